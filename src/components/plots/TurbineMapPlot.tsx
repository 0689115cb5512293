import { useMemo } from 'react';
import type { TurbineMap } from '../../../shared/maps/types';
import type { UnitSystem } from '../../lib/units';
import { PlotFrame } from './PlotFrame';
import { turbineMapFigure } from './turbine-map-figure';

/** A turbine map in the same style as the compressor map: flow parameter against expansion ratio per speed line. */
export function TurbineMapPlot({ map, unitSystem, height = 440, exportName }: { map: TurbineMap; unitSystem: UnitSystem; height?: number; exportName?: string }) {
  const figure = useMemo(() => turbineMapFigure({ map, unitSystem, height }), [map, unitSystem, height]);
  return <PlotFrame figure={figure} height={height} label={`Turbine map: ${map.name}`} exportName={exportName ?? map.name} />;
}
