import { AIR_GAS_CONSTANT } from './gas';

/**
 * The ISA troposphere (ISO 2533:1975, ICAO Doc 7488): a linear temperature lapse from sea level
 * to 11 km. Heights here are GEOPOTENTIAL heights H, in metres, as the standard tabulates them.
 * Spoolbook takes the altitude a user enters as geopotential height; below 11 km it differs from
 * geometric height by less than 0.2 % (1.4 m at 3 000 m), far inside the weather's own spread.
 */

/** Sea-level standard temperature, K (ISO 2533). */
export const ISA_SEA_LEVEL_TEMPERATURE = 288.15;
/** Sea-level standard pressure, Pa (ISO 2533). */
export const ISA_SEA_LEVEL_PRESSURE = 101_325;
/** Temperature lapse rate of the troposphere, K/m of geopotential height (ISO 2533). */
export const ISA_LAPSE_RATE = 0.0065;
/** Standard acceleration of gravity, m/s² (ISO 2533; CGPM 1901). */
export const STANDARD_GRAVITY = 9.80665;
/** Nominal Earth radius used to convert geometric to geopotential height, m (ISO 2533). */
const ISA_EARTH_RADIUS = 6_356_766;
/** Lowest geopotential height the ISO 2533 tables cover, m. */
export const ISA_MIN_HEIGHT = -2000;
/** Top of the troposphere (the tropopause), geopotential m (ISO 2533). */
export const ISA_TROPOPAUSE_HEIGHT = 11_000;
/** Exponent g0/(L·R) of the troposphere pressure law, ≈ 5.255876. */
export const ISA_PRESSURE_EXPONENT = STANDARD_GRAVITY / (ISA_LAPSE_RATE * AIR_GAS_CONSTANT);

export interface StandardAtmosphere {
  /** Geopotential height the state is for, m. */
  height: number;
  /** Temperature, K. */
  temperature: number;
  /** Absolute pressure, Pa. */
  pressure: number;
  /** Density, kg/m³. */
  density: number;
}

/** ISA temperature, K, at a geopotential height (m) in the troposphere. */
export function isaTemperature(height: number): number {
  return ISA_SEA_LEVEL_TEMPERATURE - ISA_LAPSE_RATE * height;
}

/** ISA pressure, Pa, at a geopotential height (m) in the troposphere. */
export function isaPressure(height: number): number {
  return ISA_SEA_LEVEL_PRESSURE * Math.pow(isaTemperature(height) / ISA_SEA_LEVEL_TEMPERATURE, ISA_PRESSURE_EXPONENT);
}

/** The whole ISA state at a geopotential height, m, between −2 000 m and 11 000 m. */
export function standardAtmosphere(height: number): StandardAtmosphere {
  const temperature = isaTemperature(height);
  const pressure = isaPressure(height);
  return { height, temperature, pressure, density: pressure / (AIR_GAS_CONSTANT * temperature) };
}

/** True when the height (geopotential m) lies where the troposphere law holds. */
export function isInTroposphere(height: number): boolean {
  return height >= ISA_MIN_HEIGHT && height <= ISA_TROPOPAUSE_HEIGHT;
}

/** Geopotential height H = r·z/(r + z), m, from geometric height z, m (ISO 2533). */
export function geopotentialHeight(geometricHeight: number): number {
  return (ISA_EARTH_RADIUS * geometricHeight) / (ISA_EARTH_RADIUS + geometricHeight);
}

/**
 * The air of a place as a Scenario gives it: barometric pressure (Pa absolute) and temperature
 * (K), or an altitude (m, geopotential height in the troposphere) with or without the day's
 * temperature (K).
 */
export type AmbientGiven = { pressure: number; temperature: number; altitude?: undefined } | { altitude: number; temperature?: number; pressure?: undefined };

/** Barometric pressure (Pa) and air temperature (K) of a place, and where each came from. */
export interface AmbientConditions {
  /** Ambient pressure, Pa absolute. */
  pressure: number;
  /** Ambient temperature, K. */
  temperature: number;
  pressureFrom: 'given' | 'isa';
  temperatureFrom: 'given' | 'isa';
}

/** The pressure and temperature of the air as given, the ISA at the altitude filling what is not. */
export function ambientConditions(given: AmbientGiven): AmbientConditions {
  if (given.altitude !== undefined) {
    return {
      pressure: isaPressure(given.altitude),
      temperature: given.temperature ?? isaTemperature(given.altitude),
      pressureFrom: 'isa',
      temperatureFrom: given.temperature === undefined ? 'isa' : 'given',
    };
  }
  return { pressure: given.pressure, temperature: given.temperature, pressureFrom: 'given', temperatureFrom: 'given' };
}
