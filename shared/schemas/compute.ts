/**
 * Schemas of the compute contract (`POST /api/compute`): single points with their own manifold
 * temperature, no study around them. SI throughout. Built from the engine's own input fields
 * (shared/matching/input), so a value the study refuses the contract refuses in the same words.
 * Every object is strict: an unknown key is refused by name.
 */
import { z } from 'zod';
import { ambientPressureOf, ambientSchema, manifoldPressureIssue } from '../matching/input/ambient';
import { cylindersSchema, displacementSchema, strokesSchema, volumetricEfficiencySchema } from '../matching/input/engine';
import { count, fmtKpa, fraction, isNum, rpm, temperature } from '../matching/input/fields';
import { ethanolPercentSchema, lambdaSchema } from '../matching/input/fuel-system';
import { chargeCoolerLossInputSchema, chargeCoolerLossSchema, inletLossInputSchema, inletLossSchema, type pressureLossSchema } from '../matching/input/losses';
import { mapReferenceSchema } from '../matching/input/plan';
import { bsfcSchema, drivetrainLossSchema } from '../matching/input/power';
import { requirementsSchema } from '../matching/input/requirements';
import { MAX_RPM_POINTS } from '../matching/input/rpm';
import { boostSchema } from '../matching/input/scenario';
import { fuelProperties, type FuelChoice, type PressureLossInput } from '../physics';

/** Most points one compute request may carry. */
export const MAX_COMPUTE_POINTS = MAX_RPM_POINTS;

/** The compute contract's loss: Pa at every flow (its first form), or a loss at a stated flow. */
const computeLoss = (plain: z.ZodNumber, object: ReturnType<typeof pressureLossSchema>) =>
  z
    .union([plain, object], { error: 'a loss is a number in Pa, or { pressureLoss, referenceMassFlow?, referenceDensity? }' })
    .transform((l): PressureLossInput => (typeof l === 'number' ? { pressureLoss: l } : l));

const computeFuelSchema = z
  .strictObject({
    kind: z.enum(['petrol', 'ethanol-blend', 'methanol'], { error: 'fuel kind must be petrol, ethanol-blend or methanol' }),
    ethanolPercent: ethanolPercentSchema.optional(),
    lambda: lambdaSchema,
    brakeThermalEfficiency: fraction('brake thermal efficiency').optional(),
    bsfc: bsfcSchema.optional(),
    drivetrainLoss: drivetrainLossSchema.optional(),
  })
  .superRefine((f, ctx) => {
    if (f.kind === 'ethanol-blend' && f.ethanolPercent === undefined)
      ctx.addIssue({ code: 'custom', path: ['ethanolPercent'], message: 'ethanolPercent (0 to 100, by volume) is needed for an ethanol blend' });
    if (f.kind !== 'ethanol-blend' && f.ethanolPercent !== undefined)
      ctx.addIssue({ code: 'custom', path: ['ethanolPercent'], message: 'ethanolPercent applies only to kind ethanol-blend' });
    if (f.brakeThermalEfficiency !== undefined && f.bsfc !== undefined)
      ctx.addIssue({ code: 'custom', path: ['bsfc'], message: 'give brakeThermalEfficiency or bsfc, not both' });
    if (f.bsfc !== undefined && isNum(f.bsfc)) {
      const choice: FuelChoice = f.kind === 'ethanol-blend' ? { kind: f.kind, ethanolPercent: f.ethanolPercent ?? 0 } : { kind: f.kind };
      const eta = 1 / (f.bsfc * fuelProperties(choice).lowerHeatingValue);
      if (!(eta <= 1))
        ctx.addIssue({ code: 'custom', path: ['bsfc'], message: 'bsfc is below what burning this fuel allows (brake thermal efficiency over 1)' });
    }
  });

const computePointSchema = z.strictObject({
  rpm: rpm('rpm'),
  volumetricEfficiency: volumetricEfficiencySchema,
  boost: boostSchema,
  manifoldTemperature: temperature('manifold temperature', 150, 600),
  compressorEfficiency: fraction('compressor efficiency').optional(),
});

export const computeRequestSchema = z
  .strictObject({
    engine: z.strictObject({ displacement: displacementSchema, cylinders: cylindersSchema, strokes: strokesSchema }),
    ambient: ambientSchema,
    losses: z
      .strictObject({
        inlet: computeLoss(inletLossSchema, inletLossInputSchema),
        chargeCooler: computeLoss(chargeCoolerLossSchema, chargeCoolerLossInputSchema),
      })
      .optional(),
    turbochargers: count('turbochargers', 8).optional(),
    mapReference: mapReferenceSchema.optional(),
    fuel: computeFuelSchema.optional(),
    requirements: requirementsSchema.optional(),
    points: z
      .array(computePointSchema, { error: 'points must be a list' })
      .min(1, 'give at least one point')
      .max(MAX_COMPUTE_POINTS, `at most ${MAX_COMPUTE_POINTS} points per request`),
  })
  .superRefine((req, ctx) => {
    const pAmb = ambientPressureOf(req.ambient);
    if (pAmb === null) return;
    const inlet = req.losses?.inlet.pressureLoss ?? 0;
    if (isNum(inlet) && pAmb - inlet <= 0)
      ctx.addIssue({ code: 'custom', path: ['losses', 'inlet'], message: `inlet loss leaves no pressure at the compressor inlet (ambient ${fmtKpa(pAmb)})` });
    req.points.forEach((p, i) => {
      if (!isNum(p.boost)) return;
      const issue = manifoldPressureIssue(pAmb, p.boost);
      if (issue) ctx.addIssue({ code: 'custom', path: ['points', i, 'boost'], message: issue });
    });
  });
export type ComputeRequest = z.output<typeof computeRequestSchema>;

/** One result point of the compute contract, SI; per-turbocharger values say so. */
const computeResultPointSchema = z.strictObject({
  rpm: z.number(),
  manifoldPressure: z.number(),
  airDensity: z.number(),
  /** Per turbocharger, kg/s. */
  massFlow: z.number(),
  correctedMassFlow: z.number(),
  compressorInletPressure: z.number(),
  compressorOutletPressure: z.number(),
  pressureRatio: z.number(),
  compressorOutletTemperature: z.number(),
  /** Per turbocharger, W. */
  compressorPower: z.number(),
  fuelMassFlow: z.number().optional(),
  /** W: η_b·LHV·min(ṁ_fuel, ṁ_air/AFR_s), the fuel that burns. */
  brakePower: z.number().optional(),
  wheelPower: z.number().optional(),
  /** What the engine finds at the point (outlet temperature, lean mixture under boost, input ranges), most severe first. */
  findings: z.array(z.strictObject({ code: z.string(), severity: z.enum(['info', 'warning', 'limit']), message: z.string() })),
});
export const computeResponseSchema = z.strictObject({ points: z.array(computeResultPointSchema) });
export type ComputeResultPoint = z.output<typeof computeResultPointSchema>;
export type ComputeResponse = z.output<typeof computeResponseSchema>;
