/** The drive view's units: road speed and force are not among the app's unit kinds, so they are converted here, at the edge. */
import { quantityUnit, type UnitSystem } from '#src/lib/quantities';

/** 1 mph = 0.44704 m/s and 1 lbf = 4.4482216152605 N, exactly (NIST SP 811, Appendix B.8). */
const MPH = 0.44704;
const LBF = 4.4482216152605;

export function speedUnit(system: UnitSystem) {
  return system === 'us' ? { label: 'mph', fromSI: (v: number) => v / MPH } : { label: 'km/h', fromSI: (v: number) => v * 3.6 };
}

export function forceUnit(system: UnitSystem) {
  return system === 'us' ? { label: 'lbf', fromSI: (v: number) => v / LBF } : { label: 'N', fromSI: (v: number) => v };
}

export const boostUnit = (system: UnitSystem) => quantityUnit('pressureGauge', system);
