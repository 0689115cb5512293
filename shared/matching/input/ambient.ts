/**
 * A Scenario's ambient: `{ pressure, temperature }` or `{ altitude, temperature? }`, with the
 * relative humidity of the air. Refused values name the unit slip they most likely are.
 */
import { z } from 'zod';
import {
  ambientConditions,
  humidityRatioFromRelativeHumidity,
  ISA_MIN_HEIGHT,
  ISA_SEA_LEVEL_TEMPERATURE,
  ISA_TROPOPAUSE_HEIGHT,
  type AmbientGiven,
} from '#shared/physics';
import { fmtKpa, isNum, num } from './fields';

/** Barometric pressures the atmosphere gives where engines run, Pa: about 11 km up to a deep low below sea level (ISO 2533 ISA; from memory for the weather). */
const AMBIENT_PRESSURE_RANGE = [20_000, 120_000] as const;
/** Air temperatures engines meet, K: −73 °C to +67 °C, wider than any recorded weather (from memory). */
const AMBIENT_TEMPERATURE_LIMITS = [200, 340] as const;

/** A whole number with thin groups of three: 101 325. */
const spaced = (n: number) => String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ' ');

/** Why an ambient pressure (Pa absolute) cannot be, with the unit slip it most likely is; null when it can be. */
function ambientPressureIssue(pa: number): string | null {
  const [low, high] = AMBIENT_PRESSURE_RANGE;
  if (pa >= low && pa <= high) return null;
  const base = `ambient pressure is absolute, in Pa: between ${spaced(low)} and ${spaced(high)} Pa (sea level is 101 325 Pa)`;
  const slip =
    pa >= low / 1000 && pa <= high / 1000
      ? `: ${pa} looks like kPa; write ${Math.round(pa * 1000)}`
      : pa >= low / 100_000 && pa <= high / 100_000
        ? `: ${pa} looks like bar; write ${Math.round(pa * 100_000)}`
        : pa >= low / 6894.757 && pa <= high / 6894.757
          ? `: ${pa} looks like psi; write ${Math.round(pa * 6894.757)}`
          : pa > high && pa <= high * 10
            ? ': is this gauge pressure added to the atmosphere, or hPa × 10?'
            : '';
  return `${base}${slip}`;
}

/** Why an ambient temperature (K) cannot be, with the unit slip it most likely is; null when it can be. */
function ambientTemperatureIssue(k: number): string | null {
  const [low, high] = AMBIENT_TEMPERATURE_LIMITS;
  if (k >= low && k <= high) return null;
  const base = `ambient temperature is absolute, in K, between ${low} and ${high} K (−73 to +67 °C)`;
  const slip =
    k >= low - 273.15 && k <= high - 273.15
      ? `: ${k} looks like °C; write ${Number((k + 273.15).toFixed(2))}`
      : k >= low * 1.8 && k <= high * 1.8
        ? `: ${k} looks like °R; write ${Number((k / 1.8).toFixed(2))}`
        : '';
  return `${base}${slip}`;
}

/**
 * Ambient conditions: barometric pressure and temperature, or altitude with the ISA filling what is
 * not given; `relativeHumidity` is a fraction 0–1 (absent: dry air).
 */
export type AmbientInput = AmbientGiven & { relativeHumidity?: number };

/**
 * Ambient: `{ pressure, temperature }` or `{ altitude, temperature? }`. One strict object with a
 * check rather than a union, so a bad value is reported by its own field name.
 */
export const ambientSchema = z
  .strictObject({
    pressure: num('ambient pressure')
      .check((c) => {
        const issue = ambientPressureIssue(c.value);
        if (issue) c.issues.push({ code: 'custom', input: c.value, message: issue });
      })
      .optional(),
    altitude: num('altitude')
      .min(ISA_MIN_HEIGHT, `altitude must be at least ${ISA_MIN_HEIGHT} m`)
      .max(ISA_TROPOPAUSE_HEIGHT, `altitude must be at most ${ISA_TROPOPAUSE_HEIGHT} m (the top of the ISA troposphere)`)
      .optional(),
    temperature: num('ambient temperature')
      .check((c) => {
        const issue = ambientTemperatureIssue(c.value);
        if (issue) c.issues.push({ code: 'custom', input: c.value, message: issue });
      })
      .optional(),
    relativeHumidity: num('relative humidity')
      .min(0, 'relative humidity is a fraction from 0 to 1')
      .max(1, 'relative humidity is a fraction from 0 to 1 (50 % = 0.5), not a percentage')
      .optional(),
  })
  .superRefine((a, ctx) => {
    if (a.pressure !== undefined && a.altitude !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['altitude'], message: 'give either pressure or altitude, not both' });
    } else if (a.pressure === undefined && a.altitude === undefined) {
      ctx.addIssue({ code: 'custom', path: [], message: 'give pressure (Pa) and temperature (K), or altitude (m)' });
    } else if (a.pressure !== undefined && a.temperature === undefined) {
      ctx.addIssue({ code: 'custom', path: ['temperature'], message: 'temperature (K) is needed with pressure' });
    } else if (isNum(a.relativeHumidity) && a.relativeHumidity > 0) {
      const resolved = ambientConditions(
        a.pressure !== undefined ? { pressure: a.pressure, temperature: a.temperature! } : { altitude: a.altitude ?? 0, temperature: a.temperature },
      );
      if (
        isNum(resolved.pressure) &&
        isNum(resolved.temperature) &&
        !Number.isFinite(humidityRatioFromRelativeHumidity(resolved.temperature, resolved.pressure, a.relativeHumidity))
      ) {
        ctx.addIssue({
          code: 'custom',
          path: ['relativeHumidity'],
          message: `air at ${fmtKpa(resolved.pressure)} and ${Number((resolved.temperature - 273.15).toFixed(1))} °C cannot hold that much water: its vapour pressure would reach the air's pressure`,
        });
      }
    }
  })
  .transform((a): AmbientInput => {
    const humidity = a.relativeHumidity !== undefined ? { relativeHumidity: a.relativeHumidity } : {};
    if (a.pressure !== undefined) return { pressure: a.pressure, temperature: a.temperature ?? ISA_SEA_LEVEL_TEMPERATURE, ...humidity };
    return a.temperature === undefined ? { altitude: a.altitude ?? 0, ...humidity } : { altitude: a.altitude ?? 0, temperature: a.temperature, ...humidity };
  });

/** The ambient pressure of a Scenario's ambient, Pa; null when it is not a number. */
export function ambientPressureOf(a: AmbientInput | undefined): number | null {
  if (!a) return null;
  const p = ambientConditions(a).pressure;
  return isNum(p) ? p : null;
}

/** Why a boost (Pa gauge) cannot be at an ambient pressure (Pa): a manifold pressure that is not positive; null when it can be. */
export function manifoldPressureIssue(ambientPressure: number, boost: number): string | null {
  if (ambientPressure + boost > 0) return null;
  return `boost ${fmtKpa(boost)} makes the manifold pressure ${fmtKpa(ambientPressure + boost)} absolute, which is not positive (ambient ${fmtKpa(ambientPressure)})`;
}
