/** The fuel system of a study: the fuel, lambda targets by rpm, the injectors and the pump. */
import { z } from 'zod';
import { count, num, rpm } from './fields';
import { rpmTableSchema } from './rpm';

/** Lambda target (air-fuel ratio over stoichiometric, dimensionless). */
export const lambdaSchema = num('lambda').min(0.5, 'lambda must be at least 0.5').max(2, 'lambda must be at most 2');
/** Ethanol in petrol, percent by volume. */
export const ethanolPercentSchema = num('ethanol percent').min(0, 'ethanol percent must be 0 to 100').max(100, 'ethanol percent must be 0 to 100');

export const fuelChoiceSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('petrol') }),
    z.strictObject({ kind: z.literal('ethanol-blend'), ethanolPercent: ethanolPercentSchema }),
    z.strictObject({ kind: z.literal('methanol') }),
  ],
  { error: 'fuel kind must be petrol, ethanol-blend or methanol' },
);

/** A set of identical injectors. */
const injectorSetShape = {
  count: count('injector count', 32),
  /** Density of the fluid the rating was measured with, kg/m³; absent: rated with the fuel itself. */
  ratingFluidDensity: num('rating fluid density')
    .min(500, 'rating fluid density is in kg/m³ (test fluids are about 680–780): at least 500')
    .max(1200, 'rating fluid density is in kg/m³: at most 1200')
    .optional(),
  /** Opening delay lost on every injection, s, and the battery voltage it was measured at, V; absent: none. */
  deadTime: z
    .strictObject({
      time: num('dead time').min(0, 'dead time must be 0 s or more').max(0.005, 'dead time is in s (0.9 ms = 0.0009 s); at most 0.005 s'),
      voltage: num('dead time voltage')
        .min(6, 'dead time voltage is the battery voltage it was measured at, 6 to 30 V')
        .max(30, 'dead time voltage is the battery voltage it was measured at, 6 to 30 V'),
    })
    .optional(),
  /** Rated flow of ONE injector, m³/s, at `ratedPressure`. */
  ratedFlow: num('rated flow')
    .gt(0, 'rated flow must be above 0 m³/s')
    .max(2e-4, 'rated flow is per injector in m³/s (1000 cc/min = 1.667e-5 m³/s); at most 2e-4'),
  /** Pressure difference across the injector at which `ratedFlow` holds, Pa. */
  ratedPressure: num('rated pressure')
    // Injectors are rated at a few hundred kPa (common practice, no source); far below is a slip of units, and a pressure near 0 Pa would scale the flow to infinity.
    .min(10_000, 'rated pressure is in Pa (3 bar = 300 000 Pa); at least 10 000 Pa')
    .max(20_000_000, 'rated pressure must be at most 20 MPa'),
};

const injectorsSchema = z.strictObject({
  primary: z.strictObject(injectorSetShape),
  /** The staged secondary set: opens together with the primaries from `switchOverRpm` (rpm) up. */
  secondary: z.strictObject({ ...injectorSetShape, switchOverRpm: rpm('switchOverRpm') }).optional(),
  /** Base fuel pressure, Pa gauge: above the manifold (1:1 regulator) or above the atmosphere (fixed rail). */
  fuelPressure: num('fuel pressure').gt(0, 'fuel pressure is gauge, in Pa: above 0').max(20_000_000, 'fuel pressure must be at most 20 MPa'),
  regulator: z.enum(['manifold-referenced', 'fixed-rail'], { error: 'regulator must be manifold-referenced or fixed-rail' }),
});
export type InjectorsInput = z.output<typeof injectorsSchema>;

export const fuelSystemSchema = z.strictObject({
  fuel: fuelChoiceSchema,
  /** Lambda target (air-fuel ratio over stoichiometric, dimensionless) by rpm. */
  lambda: rpmTableSchema(lambdaSchema, 'lambda'),
  injectors: injectorsSchema,
  /** Flow the fuel pump delivers at the rail pressure it must hold, m³/s, when known. */
  pumpFlowAvailable: num('pump flow')
    .gt(0, 'pump flow must be above 0 m³/s')
    .max(0.01, 'pump flow is in m³/s (255 L/h = 7.08e-5 m³/s); at most 0.01')
    .optional(),
});
