/**
 * The study's required margins and limits: what a team accepts of a plan. The verdict and the
 * thin-margin findings apply them. Every default is common practice, with no published source: a
 * team sets its own.
 */
import type { RequirementsInput } from './types';

export type Requirements = Required<RequirementsInput>;

export const REQUIREMENT_DEFAULTS: Requirements = {
  /** 5 % of corrected flow to the right of the surge line (common practice, no source). */
  minSurgeMargin: 0.05,
  /** 5 % of corrected flow to the left of the map's choke edge (common practice, no source). */
  minChokeMargin: 0.05,
  /** 3 % below the wheel's speed limit (common practice, no source). */
  minSpeedMargin: 0.03,
  /** 200 °C at the compressor outlet, where oils and hose couplers start to suffer (from memory). */
  maxCompressorOutletTemperature: 473.15,
  /** Lambda above 0.9 under boost is leaner than builders usually run a boosted engine (common practice, no source). */
  lambdaWarningUnderBoost: 0.9,
  /** Lambda above 1.0 under boost: lean of stoichiometric at load, which burns pistons and valves (common practice, no source). */
  lambdaLimitUnderBoost: 1.0,
  /** From 10 kPa gauge a point counts as under boost (common practice, no source). */
  underBoostFrom: 10_000,
};

/** The requirements with every absent field taken from the defaults. */
export function resolveRequirements(input: RequirementsInput | undefined): Requirements {
  const out = { ...REQUIREMENT_DEFAULTS };
  if (input) for (const key of Object.keys(out) as (keyof Requirements)[]) if (typeof input[key] === 'number') out[key] = input[key];
  return out;
}
