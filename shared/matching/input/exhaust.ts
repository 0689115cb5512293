/**
 * The exhaust side of a Plan (physics note §5). Absent: the Plan is judged on the compressor
 * alone. The turbine map itself is supplied at call time, like the compressor map.
 */
import { z } from 'zod';
import { fraction, num, temperature } from './fields';
import { downstreamLossSchema, pressureLossSchema } from './losses';
import { rpmTableSchema } from './rpm';

/** The wastegates of one turbocharger: one gate, or one per scroll of a divided housing. */
const wastegatesSchema = z.strictObject({
  /** Number of identical gates per turbocharger. */
  count: z.literal([1, 2], { error: 'wastegate count must be 1 or 2 (one gate, or one per scroll)' }),
  /** Valve diameter of each gate, m (its flow area is taken as π·d²/4). */
  valveDiameter: num('wastegate valve diameter')
    .gt(0, 'wastegate valve diameter must be above 0 m')
    .max(0.1, 'wastegate valve diameter is in m (44 mm = 0.044 m); at most 0.1 m'),
  /** Discharge coefficient of each gate, fraction (an assumption: real valves pass less than an ideal nozzle). */
  dischargeCoefficient: fraction('wastegate discharge coefficient'),
});

export const exhaustSchema = z
  .strictObject({
    /** Turbine housing: single-scroll, or divided (twin-scroll) fed by a divided manifold. */
    housing: z.enum(['single', 'divided'], { error: 'housing must be single or divided' }),
    wastegates: wastegatesSchema,
    /** Share of turbine power that reaches the compressor after the bearings, fraction. */
    mechanicalEfficiency: fraction('mechanical efficiency'),
    /** Turbine inlet (exhaust gas) temperature T3 by rpm, K. */
    turbineInletTemperature: rpmTableSchema(temperature('turbine inlet temperature', 400, 1500), 'turbine inlet temperature'),
    /** Pressure loss after the turbine (downpipe, catalyst, silencers), at an engine exhaust flow: p4 = p_amb + this. */
    downstreamLoss: pressureLossSchema(downstreamLossSchema, 'downstream loss', 'exhaust'),
    /**
     * Pulse-energy factor of a divided housing, multiplying turbine energy (default 1.0: none).
     * A steady model sees only mean pressures; the exhaust pulses a divided manifold keeps apart
     * carry energy it cannot see. A named assumption the user sets; only for divided housings.
     */
    pulseFactor: num('pulse factor')
      .gt(0, 'pulse factor multiplies turbine energy: above 0 (1.0 = no pulse gain)')
      .max(2, 'pulse factor must be at most 2')
      .optional(),
    /** Turbine efficiency used where the turbine map gives none, fraction (default 0.65). */
    turbineEfficiency: fraction('turbine efficiency').optional(),
  })
  .superRefine((e, ctx) => {
    if (e.housing === 'single' && e.pulseFactor !== undefined && e.pulseFactor !== 1)
      ctx.addIssue({ code: 'custom', path: ['pulseFactor'], message: 'the pulse factor applies only to a divided housing' });
  });
export type ExhaustInput = z.output<typeof exhaustSchema>;
