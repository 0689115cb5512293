/**
 * Whether the compressor can deliver a point, and what is left of the point when it cannot.
 *
 * A point left of surge, past choke, over the speed limit, above the map or outside its speed
 * lines is a place the engine asks to be, not a result: the compressor surges, cannot pass the
 * flow, would overspeed, or the map does not say it can run there. Such a point keeps what places
 * it on the map (flows, pressure ratio, margins, where it sits) and loses everything that would
 * follow from running there (efficiency, outlet temperature, power, fuel, the exhaust side), so
 * that no screen, export or peak can show it as achievable. An explicit off-map efficiency
 * assumption in the Plan makes points past choke, above the map and outside the speed lines count,
 * named in their findings; surge and overspeed are never assumed away.
 */
import type { OperatingPoint, PointValues } from '../result';
import type { MapLocation } from './model';
import type { MapRegion } from './result';

/** Where a point sits, from its place against the edges and its speed margin; null without a map. */
export function mapRegionOf(location: MapLocation | null, speedMargin: number | null): MapRegion | null {
  if (location === null) return null;
  if (location === 'left-of-surge') return 'left-of-surge';
  if (location === 'beyond-choke') return 'past-choke';
  if (speedMargin !== null && speedMargin < 0) return 'over-speed';
  if (location === 'above-top-speed') return 'above-map';
  if (location === 'off-map') return 'outside-speed-lines';
  if (location === 'below-map') return 'below-map';
  return 'on-map';
}

/** Regions an explicit off-map efficiency assumption may cover: the map is silent there, no hard limit is crossed. */
export function assumptionCovers(region: MapRegion | null): boolean {
  return region === 'past-choke' || region === 'above-map' || region === 'outside-speed-lines';
}

/** Whether the compressor can deliver a point in this region (see the module note). */
export function isReachable(region: MapRegion | null, offMapAssumption: boolean): boolean {
  if (region === null || region === 'on-map' || region === 'below-map') return true;
  return offMapAssumption && assumptionCovers(region);
}

/** Words for a region, as a table or a finding says where a point is. */
export const MAP_REGION_WORDS: Record<MapRegion, string> = {
  'on-map': 'on the map',
  'below-map': 'below the map',
  'left-of-surge': 'left of surge',
  'past-choke': 'past choke',
  'over-speed': 'over the speed limit',
  'above-map': 'above the map',
  'outside-speed-lines': 'outside the speed lines',
};

/** Every value that follows from running at a point, rather than from where it lies (screens say "not reachable" in their place). */
export const RESULT_KEYS = [
  'compressorEfficiency',
  'compressorOutletTemperature',
  'compressorPower',
  'fuelMassFlow',
  'fuelVolumeFlow',
  'brakeThermalEfficiency',
  'brakePower',
  'wheelPower',
  'torque',
  'apparentBsfc',
  'powerLimitedBy',
  'injectorPressureDifference',
  'injectorStage',
  'injectorCapacity',
  'injectorFlowDuty',
  'injectorDuty',
  'railPressure',
  'pumpFlowRequired',
  'exhaustMassFlow',
  'turbineInletTemperature',
  'turbineOutletPressure',
  'downstreamLoss',
  'exhaustGasCp',
  'exhaustGasGamma',
  'exhaustGasConstant',
  'turbineSpeedReading',
  'turbineInletPressure',
  'expansionRatio',
  'drivePressureRatio',
  'turbineFlowParameter',
  'turbineMapFlowParameter',
  'turbineMapLocation',
  'turbineEfficiency',
  'turbineMassFlow',
  'turbinePower',
  'shutGateExpansionRatio',
  'shutGateTurbineEfficiency',
  'shutGateTurbinePower',
  'wastegateMassFlow',
  'wastegateFraction',
  'wastegateDiameterNeeded',
  'wastegateMargin',
  'wastegateChoked',
] as const satisfies readonly (keyof PointValues)[];

/**
 * Clears the results of a point the compressor cannot deliver (in place), keeping the efficiency
 * that placed it as `placementEfficiency`. Call once the point is fully solved, exhaust side included.
 */
export function clearUnreachableResults(point: OperatingPoint): OperatingPoint {
  const v = point.values;
  if (!v || v.reachable !== false) return point;
  v.placementEfficiency = v.compressorEfficiency;
  const cleared = v as unknown as Record<(typeof RESULT_KEYS)[number], null>;
  for (const key of RESULT_KEYS) cleared[key] = null;
  return point;
}
