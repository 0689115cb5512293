/** The engine of a study: its size, cycle, speeds, breathing and the limits its builder states. */
import { z } from 'zod';
import { count, fraction, num, rpm, temperature } from './fields';
import { rpmPointsSchema, rpmTableSchema } from './rpm';

/** Displacement, m³: all cylinders together. */
export const displacementSchema = num('displacement')
  .gt(0, 'displacement must be above 0 m³')
  .max(0.05, 'displacement is in m³ (2.0 L = 0.002 m³); at most 0.05 m³');
export const cylindersSchema = count('cylinders', 24);
export const strokesSchema = z.literal([2, 4], { error: 'strokes must be 2 or 4' });
/** Volumetric efficiency, fraction referred to manifold density. */
export const volumetricEfficiencySchema = num('volumetric efficiency')
  .gt(0, 'volumetric efficiency must be above 0')
  .max(2, 'volumetric efficiency is a fraction, at most 2');

/** Limits the builder states for the engine; each one crossed is a finding with severity "limit". */
const engineLimitsSchema = z.strictObject({
  /** Highest allowed engine speed, rpm. */
  maxRpm: rpm('maxRpm').optional(),
  /** Highest allowed manifold pressure, Pa absolute. */
  maxManifoldPressure: num('maxManifoldPressure')
    .gt(0, 'maxManifoldPressure is absolute, in Pa: above 0')
    .max(2_000_000, 'maxManifoldPressure must be at most 2 000 000 Pa')
    .optional(),
  /** Highest allowed compressor outlet temperature, K. */
  maxCompressorOutletTemperature: temperature('maxCompressorOutletTemperature', 250, 700).optional(),
});
export type EngineLimits = z.output<typeof engineLimitsSchema>;

export const studyEngineSchema = z
  .strictObject({
    /** Total swept volume of all cylinders, m³. */
    displacement: displacementSchema,
    /** Number of cylinders. */
    cylinders: cylindersSchema,
    /** 2 or 4 stroke cycle. */
    strokes: strokesSchema,
    rpm: rpmPointsSchema,
    /** Volumetric efficiency (fraction, referred to manifold density) by rpm: of a two-stroke, its delivery ratio. */
    volumetricEfficiency: rpmTableSchema(volumetricEfficiencySchema, 'volumetric efficiency'),
    /**
     * Two-strokes only: the share of the delivered air the cylinders trap, fraction (Heywood 1988
     * §6.6). Fuel and power follow the trapped air; the compressor still passes all of it. Default 1.
     */
    trappingEfficiency: fraction('trapping efficiency').optional(),
    limits: engineLimitsSchema.optional(),
  })
  .superRefine((e, ctx) => {
    if (e.trappingEfficiency !== undefined && e.strokes !== 2)
      ctx.addIssue({ code: 'custom', path: ['trappingEfficiency'], message: 'trapping efficiency applies only to a two-stroke engine' });
  });
