import { useCallback, useRef, useState, type ReactNode } from 'react';
import { Button } from '../Button';
import type { PlotFigure } from './compressor-map-figure';
import { loadPlotly, Plot } from './Plot';

/** A file name from a title: letters, digits and dashes only. */
export function exportFileName(title: string | undefined): string {
  const base = (title ?? '')
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80);
  return base || 'spoolbook-plot';
}

type PlotEvent = { points?: { customdata?: unknown }[] };

/** Operating points carry `[lineKey, rpm]`; map curves carry nothing. */
function isLineClick(customdata: unknown): customdata is [string, number] {
  return Array.isArray(customdata) && typeof customdata[0] === 'string' && typeof customdata[1] === 'number';
}

/**
 * A plot with our own controls above it: whatever the screen puts on the left (such as the flow
 * axis switch) and image export on the right. plotly's own toolbar is hidden; dragging still zooms
 * and a double click resets the view.
 */
export function PlotFrame({
  figure,
  height,
  label,
  exportName,
  controls,
  note,
  onPointClick,
}: {
  figure: PlotFigure;
  height: number;
  /** What the plot shows, for assistive technology. */
  label: string;
  exportName?: string;
  controls?: ReactNode;
  /** A line of reading help between the controls and the plot. */
  note?: ReactNode;
  /** Called with the line key and engine speed of a clicked operating point (traces carry them as `customdata`). */
  onPointClick?: (lineKey: string, rpm: number) => void;
}) {
  const graphDiv = useRef<HTMLElement | null>(null);
  const [ready, setReady] = useState(false);
  const [exporting, setExporting] = useState<'png' | 'svg' | null>(null);
  const [exportError, setExportError] = useState<string | null>(null);

  const keepGraphDiv = useCallback((_figure: unknown, div: HTMLElement) => {
    graphDiv.current = div;
    setReady(true);
  }, []);

  async function save(format: 'png' | 'svg') {
    const div = graphDiv.current;
    if (!div) return;
    setExporting(format);
    setExportError(null);
    try {
      const Plotly = await loadPlotly();
      await Plotly.downloadImage(div, {
        format,
        filename: exportFileName(exportName),
        width: Math.max(div.clientWidth, 640),
        height,
        // A sharper raster for reports; SVG scales by itself.
        scale: format === 'png' ? 2 : 1,
      });
    } catch {
      setExportError('The image could not be made. Try again, or use the other format.');
    } finally {
      setExporting(null);
    }
  }

  return (
    <figure aria-label={label} className="space-y-2">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div className="flex flex-wrap items-center gap-3">{controls}</div>
        <div className="flex flex-wrap items-center gap-2" role="group" aria-label="Save the plot">
          <Button onClick={() => save('png')} disabled={!ready} pending={exporting === 'png'} aria-label="Save PNG of the plot (an image)">
            Save PNG
          </Button>
          <Button onClick={() => save('svg')} disabled={!ready} pending={exporting === 'svg'} aria-label="Save SVG of the plot (a drawing)">
            Save SVG
          </Button>
        </div>
      </div>
      {note}
      {exportError && (
        <p role="alert" className="text-sm text-copper-ink">
          {exportError}
        </p>
      )}
      <div className="overflow-hidden rounded-md border border-paper-line">
        <Plot
          height={height}
          placeholder="Drawing the map…"
          data={figure.data}
          layout={figure.layout}
          config={{ displayModeBar: false, displaylogo: false, responsive: true, scrollZoom: false }}
          onInitialized={keepGraphDiv}
          onUpdate={keepGraphDiv}
          onClick={
            onPointClick
              ? (event: PlotEvent) => {
                  const customdata = event.points?.[0]?.customdata;
                  if (isLineClick(customdata)) onPointClick(customdata[0], customdata[1]);
                }
              : undefined
          }
        />
      </div>
    </figure>
  );
}
