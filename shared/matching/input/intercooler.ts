/** Manifold temperature: stated, or from an intercooler's effectiveness. */
import { z } from 'zod';
import { num, temperature } from './fields';

export const intercoolerSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      kind: z.literal('fixed'),
      /** Manifold air temperature, K. */
      manifoldTemperature: temperature('manifold temperature', 150, 600),
    }),
    z.strictObject({
      kind: z.literal('effectiveness'),
      /** Intercooler effectiveness, fraction (0 means no cooling). */
      effectiveness: num('effectiveness')
        .min(0, 'effectiveness is a fraction from 0 to 1')
        .max(1, 'effectiveness is a fraction from 0 to 1 (not a percentage)'),
      /** Coolant temperature, K; when absent the scenario's ambient temperature (air-to-air). */
      coolantTemperature: temperature('coolant temperature').optional(),
    }),
  ],
  { error: 'intercooler kind must be fixed or effectiveness' },
);
export type IntercoolerInput = z.output<typeof intercoolerSchema>;
