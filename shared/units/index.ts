import { all, create, type Unit } from 'mathjs';

/**
 * The one mathjs instance of the project. Everything inside shared/ is SI; this module is the
 * edge where user units (kPa, psi, °F, lb/min, cfm, …) become SI and back.
 */
export const math = create(all, {});

// mathjs has neither inHg nor cfm. inHg is conventional inch of mercury at 0 °C
// (NIST SP 811, Appendix B.8: 3.386389 kPa); cfm is cubic feet per minute.
math.createUnit('inHg', { definition: '3386.389 Pa', aliases: ['inhg'] });
math.createUnit('cfm', { definition: '1 ft^3/min' });
// Shaft and engine speeds stay in rpm inside shared/ (the trade's unit); krpm is common on maps.
math.createUnit('rpm', { definition: '1/min' });
math.createUnit('krpm', { definition: '1000 rpm' });
// Engine builders write displacement in cubic inches as "ci"; mathjs only knows "cuin".
math.createUnit('ci', { definition: '1 cuin' });

/** The SI unit each physical quantity kind is stored in inside shared/. */
export const siUnitOf = {
  pressure: 'Pa',
  temperature: 'K',
  massFlow: 'kg/s',
  volumeFlow: 'm^3/s',
  volume: 'm^3',
  power: 'W',
  torque: 'N m',
  length: 'm',
  area: 'm^2',
  density: 'kg/m^3',
  speed: 'rpm',
  energyPerMass: 'J/kg',
} as const;
export type QuantityKind = keyof typeof siUnitOf;

/** Thrown when a unit name is unknown or does not measure the expected kind of quantity. */
export class UnitError extends Error {}

function unitOf(value: number, unitName: string): Unit {
  try {
    return math.unit(value, unitName);
  } catch {
    throw new UnitError(`unknown unit "${unitName}"`);
  }
}

/** Converts a value in `unitName` to the SI unit of `kind`; refuses units of another dimension. */
export function toSI(value: number, unitName: string, kind: QuantityKind): number {
  const u = unitOf(value, unitName);
  try {
    return u.toNumber(siUnitOf[kind]);
  } catch {
    throw new UnitError(`unit "${unitName}" does not measure ${kind}`);
  }
}

/** Converts an SI value of `kind` to `unitName`. */
export function fromSI(value: number, unitName: string, kind: QuantityKind): number {
  const u = unitOf(value, siUnitOf[kind]);
  try {
    return u.toNumber(unitName);
  } catch {
    throw new UnitError(`unit "${unitName}" does not measure ${kind}`);
  }
}

/** A unit conversion as a straight line: shown = scale·SI + offset, and back. */
export interface UnitConverter {
  fromSI: (value: number) => number;
  toSI: (value: number) => number;
}

const converters = new Map<string, UnitConverter>();

/**
 * The conversion between the SI unit of `kind` and `unitName` for converting many values: every
 * mathjs unit is affine (only the temperature scales have an offset), so the line is read off
 * mathjs once and each value is then one multiply and add instead of a mathjs unit. Throws
 * UnitError like fromSI for a unit of another dimension.
 */
export function unitConverter(unitName: string, kind: QuantityKind): UnitConverter {
  const key = `${kind}|${unitName}`;
  let converter = converters.get(key);
  if (!converter) {
    const offset = fromSI(0, unitName, kind);
    // The slope over a long span, so the rounding in the offset (273.15) does not leak into it.
    const scale = (fromSI(1e6, unitName, kind) - offset) / 1e6;
    converter = { fromSI: (v) => v * scale + offset, toSI: (v) => (v - offset) / scale };
    converters.set(key, converter);
  }
  return converter;
}

/** True when `unitName` is a known unit measuring `kind`. */
export function isUnitOf(unitName: string, kind: QuantityKind): boolean {
  try {
    toSI(1, unitName, kind);
    return true;
  } catch {
    return false;
  }
}
