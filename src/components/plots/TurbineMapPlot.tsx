import { useMemo } from 'react';
import type { TurbineMap } from '#shared/maps/types';
import { PlotFrame } from './PlotFrame';
import { turbineMapFigure } from './turbine-map-figure';
import type { TurbineOperatingLineView } from './types';
import { useUnitSystem } from '#src/lib/quantities';

/**
 * A turbine map in the same style as the compressor map: flow parameter against expansion ratio
 * per speed line, with a study's operating lines over it when given.
 */
export function TurbineMapPlot({
  map,
  height = 440,
  exportName,
  lines,
  highlight = null,
  onPointClick,
}: {
  map: TurbineMap;
  height?: number;
  exportName?: string;
  lines?: readonly TurbineOperatingLineView[];
  highlight?: { lineKey: string; rpm: number } | null;
  onPointClick?: (lineKey: string, rpm: number) => void;
}) {
  const unitSystem = useUnitSystem();
  const figure = useMemo(() => turbineMapFigure({ map, unitSystem, height, lines, highlight }), [map, unitSystem, height, lines, highlight]);
  return <PlotFrame figure={figure} height={height} label={`Turbine map: ${map.name}`} exportName={exportName ?? map.name} onPointClick={onPointClick} />;
}
