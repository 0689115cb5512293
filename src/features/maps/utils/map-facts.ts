import { mapValueFromSI } from '#shared/maps/units';
import type { CompressorMap, SpoolbookMap, TurbineMap } from '#shared/maps/types';
import { turbineEfficiencyKindMeaning } from '#shared/maps/format';
import { fromSI } from '#shared/units';
import { displayUnitOf, formatNumber, formatQuantity, krpmLabel, percentLabel, unitLabel, type UnitSystem } from '#src/lib/quantities';

/** One line of what a map holds: a term and its value in words, numbers in the user's units. */
export interface MapFact {
  term: string;
  value: string;
}

function range(values: number[]): { min: number; max: number } | null {
  const finite = values.filter(Number.isFinite);
  return finite.length ? { min: Math.min(...finite), max: Math.max(...finite) } : null;
}

function lineSpeeds(speeds: (number | null)[]): string {
  const known = speeds.filter((s): s is number => s !== null).sort((a, b) => a - b);
  const count = `${speeds.length} ${speeds.length === 1 ? 'line' : 'lines'}`;
  if (known.length === 0) return count;
  if (known.length === 1) return `${count}, ${krpmLabel(known[0])}`;
  return `${count}, ${krpmLabel(known[0]).replace(' krpm', '')} to ${krpmLabel(known[known.length - 1])}`;
}

/** A flow range in the user's unit, to three significant digits (maps are digitised to about that). */
function flowRange(min: number, max: number, system: UnitSystem): string {
  const unit = displayUnitOf('massFlow', system);
  const show = (v: number) => formatNumber(fromSI(v, unit, 'massFlow'), 3);
  return `${show(min)} to ${show(max)} ${unitLabel(unit)}`;
}

function fileValue(value: number, unit: string): string {
  return `${formatNumber(value)} ${unitLabel(unit)}`;
}

function compressorFacts(map: CompressorMap, system: UnitSystem): MapFact[] {
  const units = map.fileUnits;
  const speedLines = map.curves.filter((c) => c.kind === 'speed');
  const islands = map.curves.filter((c) => c.kind === 'island');
  const points = map.curves.flatMap((c) => c.points);
  const efficiencies = points.map((p) => p.efficiency).filter((e): e is number => e !== null);
  const pressureRatios = range(points.map((p) => p.pressureRatio));
  const flows = range(points.map((p) => p.correctedMassFlow));
  const islandValues = islands
    .map((c) => c.points.find((p) => p.efficiency !== null)?.efficiency ?? null)
    .filter((e): e is number => e !== null)
    .sort((a, b) => a - b);
  const fileTemperature = mapValueFromSI(map.reference.temperature, units.referenceTemperatureUnit, 'temperature');
  const filePressure = mapValueFromSI(map.reference.pressure, units.referencePressureUnit, 'pressure');

  return [
    { term: 'Flow in the file', value: `${units.flowAxis === 'volume' ? 'Inlet volume flow' : 'Corrected mass flow'}, ${unitLabel(units.flowUnit)}` },
    {
      term: 'Reference conditions',
      value: `${formatQuantity(map.reference.temperature, 'temperature', system)}, ${formatQuantity(map.reference.pressure, 'pressure', system)} (file: ${fileValue(fileTemperature, units.referenceTemperatureUnit)}, ${fileValue(filePressure, units.referencePressureUnit)})`,
    },
    ...(flows ? [{ term: 'Corrected mass flow', value: flowRange(flows.min, flows.max, system) }] : []),
    ...(pressureRatios ? [{ term: 'Pressure ratio', value: `up to ${formatNumber(pressureRatios.max)}` }] : []),
    { term: 'Speed lines', value: lineSpeeds(speedLines.map((c) => c.points[0]?.speed ?? null)) },
    { term: 'Rated speed', value: map.maxSpeed !== null ? krpmLabel(map.maxSpeed) : 'not given (speed margin needs it from the plan)' },
    {
      term: 'Efficiency islands',
      value: islandValues.length ? islandValues.map((e) => formatNumber(e * 100, 3)).join(', ') + ' %' : 'none',
    },
    ...(efficiencies.length ? [{ term: 'Peak efficiency', value: percentLabel(Math.max(...efficiencies)) }] : []),
  ];
}

function turbineFacts(map: TurbineMap): MapFact[] {
  const points = map.curves.flatMap((c) => c.points);
  const ratios = range(points.map((p) => p.expansionRatio));
  const housing =
    map.housing === 'single' ? 'Single scroll' : `Divided, ${map.scrollFeed === 'per-scroll' ? 'flow of one scroll' : 'both scrolls fed together'}`;
  return [
    { term: 'Housing', value: housing },
    { term: 'A/R', value: map.areaRatio !== null ? formatNumber(map.areaRatio) : 'not given' },
    { term: 'Efficiency', value: turbineEfficiencyKindMeaning(map.efficiencyKind) },
    { term: 'Speed lines', value: lineSpeeds(map.curves.map((c) => c.points.find((p) => p.speed !== null)?.speed ?? null)) },
    ...(ratios ? [{ term: 'Expansion ratio', value: `${formatNumber(ratios.min)} to ${formatNumber(ratios.max)}` }] : []),
    { term: 'Flow parameter in the file', value: unitLabel(map.fileUnits.flowParameterUnit) },
  ];
}

/** What a map holds, for the library preview and the map's page. */
export function mapFacts(map: SpoolbookMap, system: UnitSystem): MapFact[] {
  return map.kind === 'compressor' ? compressorFacts(map, system) : turbineFacts(map);
}

export const mapKindNames = { compressor: 'Compressor map', turbine: 'Turbine map' } as const;
