import type { Data } from 'plotly.js-dist-min';
import type { CompressorMap } from '#shared/maps/types';
import { compressorMapFigure, flowScale, type PlotFigure } from '#src/components/plots/compressor-map-figure';
import type { OperatingLineView } from '#src/components/plots/types';
import type { UnitSystem } from '#src/lib/quantities';
import { plotText } from '#src/components/plots/style';

/** Another map whose edges are drawn over the one shown, in the colour of its first combination. */
export interface OverlaidMap {
  map: CompressorMap;
  name: string;
  colour: string;
}

function edgeTraces(overlay: OverlaidMap, flowAxis: 'corrected' | 'volume', system: UnitSystem): Data[] {
  // Each map's flows are turned into the axis unit with its own reference (matters on the volume axis).
  const scale = flowScale(overlay.map, flowAxis, system);
  const traces: Data[] = [];
  for (const curve of overlay.map.curves) {
    if (curve.kind !== 'surge' && curve.kind !== 'choke') continue;
    const what = curve.kind === 'surge' ? 'Surge line' : 'Choke limit';
    traces.push({
      type: 'scatter',
      mode: 'lines',
      name: `${what} · ${overlay.name}`,
      legendgroup: `overlay:${overlay.name}:${curve.kind}`,
      x: curve.points.map((p) => p.correctedMassFlow * scale.perCorrectedMassFlow),
      y: curve.points.map((p) => p.pressureRatio),
      line: { color: overlay.colour, width: 2, dash: curve.kind === 'surge' ? 'dot' : 'dashdot' },
      hovertemplate: `${plotText(`${what} of ${overlay.name}`)}<extra></extra>`,
    });
  }
  return traces;
}

function finiteValues(traces: readonly Data[], axis: 'x' | 'y'): number[] {
  const out: number[] = [];
  for (const t of traces) {
    const values = (t as { x?: unknown; y?: unknown })[axis];
    if (Array.isArray(values)) for (const v of values) if (typeof v === 'number' && Number.isFinite(v)) out.push(v);
  }
  return out;
}

/**
 * The Side by side map: the chosen map in full, the operating lines of the chosen combinations,
 * and the surge and choke lines of the other maps those combinations use, so every line can be
 * judged against its own compressor's edges.
 */
export function compareFigure(args: {
  map: CompressorMap | null;
  overlays: readonly OverlaidMap[];
  lines: readonly OperatingLineView[];
  flowAxis: 'corrected' | 'volume';
  unitSystem: UnitSystem;
  highlight?: { lineKey: string; rpm: number } | null;
  height: number;
}): PlotFigure {
  const base = compressorMapFigure({
    map: args.map,
    lines: [...args.lines],
    flowAxis: args.flowAxis,
    unitSystem: args.unitSystem,
    highlight: args.highlight ?? null,
    height: args.height,
  });
  const extra = args.overlays.flatMap((o) => edgeTraces(o, args.flowAxis, args.unitSystem));
  // Up to four lines and the other maps' edges make a long legend: under the plot, not over the map.
  base.layout.legend = { ...base.layout.legend, orientation: 'h', x: 0, xanchor: 'left', y: -0.14, yanchor: 'top' };
  if (extra.length === 0) return base;
  // The base figure fits its axes to its own traces; widen them to take in the other maps' edges.
  const xs = finiteValues([...base.data, ...extra], 'x');
  const ys = finiteValues([...base.data, ...extra], 'y');
  const maxX = xs.length ? Math.max(...xs) : null;
  const maxY = ys.length ? Math.max(...ys) : null;
  const layout = { ...base.layout };
  if (maxX !== null) layout.xaxis = { ...layout.xaxis, range: [0, maxX * 1.12] };
  if (maxY !== null) layout.yaxis = { ...layout.yaxis, range: [1, 1 + (maxY - 1) * 1.06 + 0.02] };
  // Overlays go under the operating lines so the points stay on top.
  const firstLine = base.data.findIndex((t) => String((t as { legendgroup?: unknown }).legendgroup ?? '').startsWith('line:'));
  const split = firstLine === -1 ? base.data.length : firstLine;
  return { data: [...base.data.slice(0, split), ...extra, ...base.data.slice(split)], layout };
}
