/**
 * The study's required margins and limits: what a team accepts of a plan. The verdict and the
 * thin-margin findings apply them. Every default is common practice, with no published source: a
 * team sets its own.
 */
import { z } from 'zod';
import { isNum, num, temperature } from './fields';

/** The study's required margins and limits (each absent one takes its default, REQUIREMENT_DEFAULTS). */
export const requirementsSchema = z
  .strictObject({
    /** Smallest surge margin accepted, fraction of corrected flow. */
    minSurgeMargin: num('minSurgeMargin')
      .min(0, 'minSurgeMargin is a fraction, 0 or more')
      .max(0.5, 'minSurgeMargin is a fraction (5 % = 0.05), at most 0.5')
      .optional(),
    /** Smallest choke margin accepted, fraction of corrected flow. */
    minChokeMargin: num('minChokeMargin')
      .min(0, 'minChokeMargin is a fraction, 0 or more')
      .max(0.5, 'minChokeMargin is a fraction (5 % = 0.05), at most 0.5')
      .optional(),
    /** Smallest speed margin accepted, fraction of the speed limit. */
    minSpeedMargin: num('minSpeedMargin')
      .min(0, 'minSpeedMargin is a fraction, 0 or more')
      .max(0.5, 'minSpeedMargin is a fraction (3 % = 0.03), at most 0.5')
      .optional(),
    /** Highest compressor outlet temperature accepted, K (above it: a warning; the engine's stated limit stays a hard limit). */
    maxCompressorOutletTemperature: temperature('maxCompressorOutletTemperature', 300, 700).optional(),
    /** Lambda above which a point under boost raises a warning. */
    lambdaWarningUnderBoost: num('lambdaWarningUnderBoost')
      .min(0.5, 'lambdaWarningUnderBoost must be at least 0.5')
      .max(2, 'lambdaWarningUnderBoost must be at most 2')
      .optional(),
    /** Lambda above which a point under boost is at a limit (lean under boost burns pistons and valves). */
    lambdaLimitUnderBoost: num('lambdaLimitUnderBoost')
      .min(0.5, 'lambdaLimitUnderBoost must be at least 0.5')
      .max(2, 'lambdaLimitUnderBoost must be at most 2')
      .optional(),
    /** Boost from which a point counts as under boost, Pa gauge. */
    underBoostFrom: num('underBoostFrom')
      .min(0, 'underBoostFrom is gauge pressure in Pa, 0 or more')
      .max(500_000, 'underBoostFrom is gauge pressure in Pa (10 kPa = 10 000 Pa); at most 500 000 Pa')
      .optional(),
  })
  .superRefine((r, ctx) => {
    // Either one may be left to its default: compare what will apply.
    const warning = r.lambdaWarningUnderBoost ?? REQUIREMENT_DEFAULTS.lambdaWarningUnderBoost;
    const limit = r.lambdaLimitUnderBoost ?? REQUIREMENT_DEFAULTS.lambdaLimitUnderBoost;
    if (isNum(warning) && isNum(limit) && warning > limit)
      ctx.addIssue({
        code: 'custom',
        path: [r.lambdaWarningUnderBoost !== undefined ? 'lambdaWarningUnderBoost' : 'lambdaLimitUnderBoost'],
        message: 'the lambda warning must be at or below the lambda limit',
      });
  });

/** What a team requires of a plan; every field absent takes its default. */
export type RequirementsInput = z.output<typeof requirementsSchema>;
/** The requirements with every field set. */
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
