import { useState } from 'react';
import type { SpoolbookMap } from '#shared/maps/types';
import { CompressorMapPlot } from '#src/components/plots/CompressorMapPlot';
import { TurbineMapPlot } from '#src/components/plots/TurbineMapPlot';

/** A map drawn alone (no study): compressor maps open on the flow axis their file uses. */
export function MapPlot({ map, height }: { map: SpoolbookMap; height?: number }) {
  const [flowAxis, setFlowAxis] = useState<'corrected' | 'volume'>(map.kind === 'compressor' && map.fileUnits.flowAxis === 'volume' ? 'volume' : 'corrected');
  if (map.kind === 'turbine') return <TurbineMapPlot map={map} height={height} />;
  return <CompressorMapPlot map={map} flowAxis={flowAxis} onFlowAxisChange={setFlowAxis} height={height} />;
}
