import { useMemo } from 'react';
import type { CompressorMap, TurbineMap } from '../../../../shared/maps/types';
import { compressorMapFigure, type PlotFigure } from '../../../components/plots/compressor-map-figure';
import { PlotFrame } from '../../../components/plots/PlotFrame';
import { turbineMapFigure } from '../../../components/plots/turbine-map-figure';
import type { OperatingLineView, TurbineOperatingLineView } from '../../../components/plots/types';
import type { UnitSystem } from '../../../lib/units';

/** A figure with its legend under the plot, so a study's many lines do not cover the map. */
export function legendBelow(figure: PlotFigure): PlotFigure {
  return { ...figure, layout: { ...figure.layout, legend: { ...figure.layout.legend, orientation: 'h', x: 0, xanchor: 'left', y: -0.14, yanchor: 'top' } } };
}

function isLineClick(customdata: unknown): customdata is [string, number] {
  return Array.isArray(customdata) && typeof customdata[0] === 'string' && typeof customdata[1] === 'number';
}

/**
 * A compressor map with a whole study's lines on it: the shared map figure and plot frame, with
 * the legend moved under the plot (a study has up to a few dozen lines; over the map they hide it).
 */
export function StudyMapFigure({
  map,
  lines,
  unitSystem,
  height,
  highlight = null,
  onPointClick,
  exportName,
}: {
  map: CompressorMap | null;
  lines: OperatingLineView[];
  unitSystem: UnitSystem;
  height: number;
  highlight?: { lineKey: string; rpm: number } | null;
  onPointClick?: (lineKey: string, rpm: number) => void;
  exportName?: string;
}) {
  const figure = useMemo(() => legendBelow(compressorMapFigure({ map, lines, flowAxis: 'corrected', unitSystem, highlight, height })), [map, lines, unitSystem, highlight, height]);
  return (
    <PlotFrame
      figure={figure}
      height={height}
      label={map ? `Compressor map: ${map.name}` : 'Operating lines'}
      exportName={exportName ?? map?.name}
      onPointClick={
        onPointClick
          ? (customdata) => {
              if (isLineClick(customdata)) onPointClick(customdata[0], customdata[1]);
            }
          : undefined
      }
    />
  );
}

/** A turbine map with the operating lines of the plans drawn on it, legend under the plot like the compressor map's. */
export function StudyTurbineMapFigure({
  map,
  lines,
  unitSystem,
  height,
  highlight = null,
  onPointClick,
  exportName,
}: {
  map: TurbineMap;
  lines: TurbineOperatingLineView[];
  unitSystem: UnitSystem;
  height: number;
  highlight?: { lineKey: string; rpm: number } | null;
  onPointClick?: (lineKey: string, rpm: number) => void;
  exportName?: string;
}) {
  const figure = useMemo(() => legendBelow(turbineMapFigure({ map, lines, unitSystem, highlight, height })), [map, lines, unitSystem, highlight, height]);
  return (
    <PlotFrame
      figure={figure}
      height={height}
      label={`Turbine map: ${map.name}`}
      exportName={exportName ?? map.name}
      onPointClick={
        onPointClick
          ? (customdata) => {
              if (isLineClick(customdata)) onPointClick(customdata[0], customdata[1]);
            }
          : undefined
      }
    />
  );
}
