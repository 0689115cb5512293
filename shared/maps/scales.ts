import { AIR_GAS_CONSTANT, type EfficiencyScale } from './format';
import type { CompressorFileUnits, MapReferenceConditions } from './types';
import { scaleToSI } from './units';

/**
 * Factors from file units to SI, shared by the reader and the writer: a column is read as
 * value·factor and written as si/factor, so a written file reads back to the same numbers.
 */

/** Reference inlet density ρ_ref = p_ref/(R·T_ref), kg/m³: turns a volume-flow map into corrected mass flow. */
export function referenceDensity(reference: MapReferenceConditions): number {
  return reference.pressure / (AIR_GAS_CONSTANT * reference.temperature);
}

/** kg/s of corrected mass flow per unit of the file's flow column. */
export function compressorFlowScale(units: Pick<CompressorFileUnits, 'flowAxis' | 'flowUnit'>, reference: MapReferenceConditions): number {
  return units.flowAxis === 'volume' ? scaleToSI(units.flowUnit, 'volumeFlow') * referenceDensity(reference) : scaleToSI(units.flowUnit, 'massFlow');
}

/** Fraction per unit of the file's efficiency column. */
export function efficiencyScale(scale: EfficiencyScale): number {
  return scale === 'percent' ? 0.01 : 1;
}

/** rpm per unit of the file's speed column. */
export function speedScale(unit: string): number {
  return scaleToSI(unit, 'speed');
}

/** kg·K^0.5/(s·Pa) per unit of the file's flow parameter column. */
export function flowParameterScale(unit: string): number {
  return scaleToSI(unit, 'flowParameter');
}
