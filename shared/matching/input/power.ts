/** How brake power follows from the air: a brake thermal efficiency, or a BSFC referred to the fuel that burns. */
import { z } from 'zod';
import { fraction, num } from './fields';

/** Drivetrain loss, fraction of brake power. */
export const drivetrainLossSchema = num('drivetrain loss').min(0, 'drivetrain loss must be 0 or more').max(0.9, 'drivetrain loss is a fraction, at most 0.9');
/** Brake specific fuel consumption, kg/J, referred to the stoichiometric share of the fuel. */
export const bsfcSchema = num('bsfc').gt(0, 'bsfc must be above 0 kg/J').max(1e-6, 'bsfc is in kg/J (250 g/kWh = 6.94e-8 kg/J); at most 1e-6 kg/J');

export const powerSchema = z.discriminatedUnion(
  'basis',
  [
    z.strictObject({
      basis: z.literal('brake-thermal-efficiency'),
      /** Brake thermal efficiency, fraction. */
      brakeThermalEfficiency: fraction('brake thermal efficiency'),
      /** Drivetrain loss, fraction of brake power. */
      drivetrainLoss: drivetrainLossSchema,
    }),
    z.strictObject({
      basis: z.literal('bsfc'),
      /** Brake specific fuel consumption, kg/J, referred to the stoichiometric share of the fuel. */
      bsfc: bsfcSchema,
      /** Drivetrain loss, fraction of brake power. */
      drivetrainLoss: drivetrainLossSchema,
    }),
  ],
  { error: 'power basis must be brake-thermal-efficiency or bsfc' },
);
export type PowerAssumptions = z.output<typeof powerSchema>;
