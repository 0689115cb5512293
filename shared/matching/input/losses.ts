/**
 * Pressure losses, each at the engine flow it was measured at (and the gas density then), so that
 * it follows the flow as ṁ²/ρ; without a flow a loss is the same at every flow (the older form).
 */
import { z } from 'zod';
import { num } from './fields';

/** Filter and intake loss, Pa. */
export const inletLossSchema = num('inlet loss').min(0, 'inlet loss must be 0 Pa or more').max(50_000, 'inlet loss must be at most 50 000 Pa');
/** Charge-cooler and pipe loss, Pa. */
export const chargeCoolerLossSchema = num('charge-cooler loss')
  .min(0, 'charge-cooler loss must be 0 Pa or more')
  .max(100_000, 'charge-cooler loss must be at most 100 000 Pa');
/** Loss after the turbine, Pa. */
export const downstreamLossSchema = num('downstream loss')
  .min(0, 'downstream loss must be 0 Pa or more')
  .max(200_000, 'downstream loss is in Pa; at most 200 000 Pa');

/**
 * A pressure loss at the engine flow it was measured at (and the gas density then): it follows
 * the flow as ṁ²/ρ. Without `referenceMassFlow` it is the same at every flow (the older form).
 */
export function pressureLossSchema(loss: z.ZodNumber, what: string, flow: 'air' | 'exhaust') {
  return z
    .strictObject({
      /** The loss, Pa: at `referenceMassFlow` when given, otherwise at every flow. */
      pressureLoss: loss,
      /** The engine's mass flow the loss was measured at, kg/s (air for the intake and cooler, exhaust after the turbine); absent: a fixed loss. */
      referenceMassFlow: num(`${what} reference flow`)
        .gt(0, `${what} reference flow is the engine's ${flow} mass flow the loss was measured at, above 0 kg/s`)
        .max(5, `${what} reference flow is in kg/s (40 lb/min = 0.302 kg/s); at most 5 kg/s`)
        .optional(),
      /** Density of the gas at that measurement, kg/m³; absent: standard sea-level air. */
      referenceDensity: num(`${what} reference density`)
        .gt(0.05, `${what} reference density is in kg/m³ (sea-level air is 1.225): above 0.05`)
        .max(20, `${what} reference density is in kg/m³ (sea-level air is 1.225); at most 20`)
        .optional(),
    })
    .superRefine((l, ctx) => {
      if (l.referenceDensity !== undefined && l.referenceMassFlow === undefined)
        ctx.addIssue({
          code: 'custom',
          path: ['referenceDensity'],
          message: `${what} reference density applies only with the reference flow it was measured at`,
        });
    });
}
export const inletLossInputSchema = pressureLossSchema(inletLossSchema, 'inlet loss', 'air');
export const chargeCoolerLossInputSchema = pressureLossSchema(chargeCoolerLossSchema, 'charge-cooler loss', 'air');

export const lossesSchema = z.strictObject({
  /** Filter and intake pressure loss before the compressor, at an engine air flow. */
  inlet: inletLossInputSchema,
  /** Pressure loss from compressor outlet to manifold (charge cooler and pipes), at an engine air flow. */
  chargeCooler: chargeCoolerLossInputSchema,
  /** Heating of the air before the compressor (under-bonnet intake), K. Default 0. */
  inletTemperatureRise: num('inlet temperature rise')
    .min(0, 'inlet temperature rise must be 0 K or more')
    .max(100, 'inlet temperature rise must be at most 100 K')
    .optional(),
});
export type LossesInput = z.output<typeof lossesSchema>;
