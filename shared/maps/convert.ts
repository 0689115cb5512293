import type { CompressorFileUnits, CompressorMap, MapReferenceConditions, SpoolbookMap } from './types';
import { readUnit, type MapQuantity } from './units';

/**
 * Re-expresses a compressor map against other reference conditions. Corrected mass flow is
 * ṁc = ṁ·√(T1/T_ref)·(p_ref/p1), so one physical flow reads ṁc·√(T_old/T_new)·(p_new/p_old) at the new
 * reference. Pressure ratio, efficiency and the speed labels do not change (speeds are read as
 * shaft speed, see docs/map-format.md).
 */
export function withReference(map: CompressorMap, reference: MapReferenceConditions): CompressorMap {
  if (!(reference.temperature > 0 && reference.pressure > 0)) {
    throw new Error('withReference: reference temperature (K) and pressure (Pa) must be above 0');
  }
  const factor = Math.sqrt(map.reference.temperature / reference.temperature) * (reference.pressure / map.reference.pressure);
  return {
    ...map,
    reference: { ...reference },
    curves: map.curves.map((curve) => ({
      ...curve,
      points: curve.points.map((p) => ({ ...p, correctedMassFlow: p.correctedMassFlow * factor })),
    })),
  };
}

function checkedUnit(text: string, kind: MapQuantity, field: string): string {
  const reading = readUnit(text, kind);
  if (!reading.ok) throw new Error(`${field}: ${reading.message}`);
  return reading.unit;
}

/** The same compressor map, to be written in other units (the SI content is unchanged). */
export function withCompressorFileUnits(map: CompressorMap, units: Partial<CompressorFileUnits>): CompressorMap {
  const next = { ...map.fileUnits, ...units };
  checkedUnit(next.flowUnit, next.flowAxis === 'volume' ? 'volumeFlow' : 'massFlow', 'fileUnits.flowUnit');
  checkedUnit(next.referenceTemperatureUnit, 'temperature', 'fileUnits.referenceTemperatureUnit');
  checkedUnit(next.referencePressureUnit, 'pressure', 'fileUnits.referencePressureUnit');
  checkedUnit(next.speedUnit, 'speed', 'fileUnits.speedUnit');
  checkedUnit(next.maxSpeedUnit, 'speed', 'fileUnits.maxSpeedUnit');
  return { ...map, fileUnits: next };
}

/** The map with a new name and notes (notes as one text; each line becomes a `# note:` line). */
export function withMetadata<M extends SpoolbookMap>(map: M, metadata: { name?: string; notes?: string }): M {
  return {
    ...map,
    name: metadata.name ?? map.name,
    notes: metadata.notes === undefined ? map.notes : metadata.notes === '' ? [] : metadata.notes.split(/\r\n|\r|\n/),
  };
}
