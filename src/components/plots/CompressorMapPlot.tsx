import { useMemo } from 'react';
import { useUnitSystem } from '#src/lib/quantities';
import { compressorMapFigure } from './compressor-map-figure';
import { FlowAxisSwitch } from './FlowAxisSwitch';
import { PlotFrame } from './PlotFrame';
import type { CompressorMapPlotProps } from './types';

const DEFAULT_HEIGHT = 520;

/**
 * The compressor map (surge line, choke limit, speed lines, efficiency islands) with the
 * operating lines of a study over it, in the user's units. plotly.js loads when this first shows.
 */
export function CompressorMapPlot({
  map,
  lines,
  flowAxis = 'corrected',
  onFlowAxisChange,
  highlight = null,
  onPointClick,
  height = DEFAULT_HEIGHT,
  exportName,
}: CompressorMapPlotProps) {
  const unitSystem = useUnitSystem();
  const figure = useMemo(
    () => compressorMapFigure({ map, lines, flowAxis, unitSystem, highlight, height }),
    [map, lines, flowAxis, unitSystem, highlight, height],
  );
  return (
    <PlotFrame
      figure={figure}
      height={height}
      label={map ? `Compressor map: ${map.name}` : 'Operating lines'}
      exportName={exportName ?? map?.name}
      controls={onFlowAxisChange ? <FlowAxisSwitch value={flowAxis} onChange={onFlowAxisChange} /> : undefined}
      onPointClick={onPointClick}
    />
  );
}
