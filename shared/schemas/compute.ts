/**
 * Schemas of the compute contract (`POST /api/compute`) and of the study input runStudy takes.
 * SI throughout. Every object is strict: an unknown key is refused by name, so a misspelt field
 * never passes silently. Messages name the unit expected, since most bad values are unit slips.
 */
import { z } from 'zod';
import {
  humidityRatioFromRelativeHumidity,
  ISA_MIN_HEIGHT,
  ISA_TROPOPAUSE_HEIGHT,
  ISA_SEA_LEVEL_PRESSURE,
  ISA_SEA_LEVEL_TEMPERATURE,
  fuelProperties,
  type FuelChoice,
  type PressureLossInput,
} from '../physics';
import { resolveAmbient } from '../matching/ambient';
import { MAX_RPM_POINTS, rpmPointCount } from '../matching/rpm-table';
import { REQUIREMENT_DEFAULTS } from '../matching/requirements';
import type { AmbientInput, StudyInput } from '../matching/types';

/** Most points one compute request may carry. */
export const MAX_COMPUTE_POINTS = MAX_RPM_POINTS;
/** Most rows in one table by rpm. */
export const MAX_TABLE_ROWS = 100;
export const MAX_SCENARIOS = 20;
export const MAX_PLANS = 10;
export const MAX_BOOST_ROWS = 20;
/** Most points of a whole study (plans × boost rows × rpm points). */
export const MAX_STUDY_POINTS = 50_000;

/** Standard-day sea level: the corrected-flow reference when no map or Plan names one. */
export const STANDARD_REFERENCE = { temperature: ISA_SEA_LEVEL_TEMPERATURE, pressure: ISA_SEA_LEVEL_PRESSURE } as const;

const num = (what: string) => z.number({ error: `${what} must be a number` });
const fraction = (what: string) =>
  num(what).gt(0, `${what} is a fraction above 0`).max(1, `${what} is a fraction from 0 to 1 (not a percentage); above 1 is impossible`);
const temperature = (what: string, min = 150, max = 400) =>
  num(what)
    .min(min, `${what} is absolute temperature in K, at least ${min} K (was °C given?)`)
    .max(max, `${what} is absolute temperature in K, at most ${max} K`);
const rpm = (what = 'rpm') => num(what).gt(0, `${what} must be above 0 rpm`).max(30_000, `${what} must be at most 30 000 rpm`);
const count = (what: string, max: number) =>
  num(what).int(`${what} must be a whole number`).min(1, `${what} must be at least 1`).max(max, `${what} must be at most ${max}`);
const name = (what: string) =>
  z
    .string({ error: `${what} must be text` })
    .trim()
    .min(1, `${what} must not be empty`)
    .max(100, `${what} must be at most 100 characters`);

/** Displacement, m³: all cylinders together. */
export const displacementSchema = num('displacement')
  .gt(0, 'displacement must be above 0 m³')
  .max(0.05, 'displacement is in m³ (2.0 L = 0.002 m³); at most 0.05 m³');
export const cylindersSchema = count('cylinders', 24);
export const strokesSchema = z.literal([2, 4], { error: 'strokes must be 2 or 4' });

/** Reference conditions of corrected flow. */
export const mapReferenceSchema = z.strictObject({
  temperature: temperature('reference temperature'),
  pressure: num('reference pressure')
    .min(10_000, 'reference pressure is absolute, in Pa: at least 10 000 Pa')
    .max(200_000, 'reference pressure is absolute, in Pa: at most 200 000 Pa'),
});

/** Barometric pressures the atmosphere gives where engines run, Pa: about 11 km up to a deep low below sea level (ISO 2533 ISA; from memory for the weather). */
export const AMBIENT_PRESSURE_RANGE = [20_000, 120_000] as const;
/** Air temperatures engines meet, K: −73 °C to +67 °C, wider than any recorded weather (from memory). */
export const AMBIENT_TEMPERATURE_LIMITS = [200, 340] as const;

/** A whole number with thin groups of three: 101 325. */
const spaced = (n: number) => String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ' ');

/** Why an ambient pressure (Pa absolute) cannot be, with the unit slip it most likely is; null when it can be. */
export function ambientPressureIssue(pa: number): string | null {
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
export function ambientTemperatureIssue(k: number): string | null {
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
      const resolved = resolveAmbient(
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

const lambdaSchema = num('lambda').min(0.5, 'lambda must be at least 0.5').max(2, 'lambda must be at most 2');
const boostSchema = num('boost')
  .min(-200_000, 'boost is gauge pressure in Pa: at least −200 000 Pa')
  .max(1_000_000, 'boost is gauge pressure in Pa: at most 1 000 000 Pa');
const inletLossSchema = num('inlet loss').min(0, 'inlet loss must be 0 Pa or more').max(50_000, 'inlet loss must be at most 50 000 Pa');
const chargeCoolerLossSchema = num('charge-cooler loss')
  .min(0, 'charge-cooler loss must be 0 Pa or more')
  .max(100_000, 'charge-cooler loss must be at most 100 000 Pa');
const downstreamLossSchema = num('downstream loss').min(0, 'downstream loss must be 0 Pa or more').max(200_000, 'downstream loss is in Pa; at most 200 000 Pa');

/**
 * A pressure loss at the engine flow it was measured at (and the gas density then): it follows
 * the flow as ṁ²/ρ. Without `referenceMassFlow` it is the same at every flow (the older form).
 */
export function pressureLossSchema(loss: z.ZodNumber, what: string, flow: 'air' | 'exhaust') {
  return z
    .strictObject({
      pressureLoss: loss,
      referenceMassFlow: num(`${what} reference flow`)
        .gt(0, `${what} reference flow is the engine's ${flow} mass flow the loss was measured at, above 0 kg/s`)
        .max(5, `${what} reference flow is in kg/s (40 lb/min = 0.302 kg/s); at most 5 kg/s`)
        .optional(),
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
const inletLossInputSchema = pressureLossSchema(inletLossSchema, 'inlet loss', 'air');
const chargeCoolerLossInputSchema = pressureLossSchema(chargeCoolerLossSchema, 'charge-cooler loss', 'air');
/** The compute contract's loss: Pa at every flow (its first form), or a loss at a stated flow. */
const computeLoss = (plain: z.ZodNumber, object: ReturnType<typeof pressureLossSchema>) =>
  z
    .union([plain, object], { error: 'a loss is a number in Pa, or { pressureLoss, referenceMassFlow?, referenceDensity? }' })
    .transform((l): PressureLossInput => (typeof l === 'number' ? { pressureLoss: l } : l));
const drivetrainLossSchema = num('drivetrain loss').min(0, 'drivetrain loss must be 0 or more').max(0.9, 'drivetrain loss is a fraction, at most 0.9');
const bsfcSchema = num('bsfc').gt(0, 'bsfc must be above 0 kg/J').max(1e-6, 'bsfc is in kg/J (250 g/kWh = 6.94e-8 kg/J); at most 1e-6 kg/J');
const ethanolPercentSchema = num('ethanol percent').min(0, 'ethanol percent must be 0 to 100').max(100, 'ethanol percent must be 0 to 100');

function manifoldPressureIssue(ambientPressure: number, boost: number): string | null {
  if (ambientPressure + boost > 0) return null;
  return `boost ${fmtKpa(boost)} makes the manifold pressure ${fmtKpa(ambientPressure + boost)} absolute, which is not positive (ambient ${fmtKpa(ambientPressure)})`;
}
const fmtKpa = (pa: number) => `${Number((pa / 1000).toPrecision(4))} kPa`;
const isNum = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);
const ambientPressureOf = (a: AmbientInput | undefined): number | null => {
  if (!a) return null;
  const p = resolveAmbient(a).pressure;
  return isNum(p) ? p : null;
};

/** The study's required margins and limits (each absent one takes its default, REQUIREMENT_DEFAULTS). */
export const requirementsSchema = z
  .strictObject({
    minSurgeMargin: num('minSurgeMargin')
      .min(0, 'minSurgeMargin is a fraction, 0 or more')
      .max(0.5, 'minSurgeMargin is a fraction (5 % = 0.05), at most 0.5')
      .optional(),
    minChokeMargin: num('minChokeMargin')
      .min(0, 'minChokeMargin is a fraction, 0 or more')
      .max(0.5, 'minChokeMargin is a fraction (5 % = 0.05), at most 0.5')
      .optional(),
    minSpeedMargin: num('minSpeedMargin')
      .min(0, 'minSpeedMargin is a fraction, 0 or more')
      .max(0.5, 'minSpeedMargin is a fraction (3 % = 0.03), at most 0.5')
      .optional(),
    maxCompressorOutletTemperature: temperature('maxCompressorOutletTemperature', 300, 700).optional(),
    lambdaWarningUnderBoost: num('lambdaWarningUnderBoost')
      .min(0.5, 'lambdaWarningUnderBoost must be at least 0.5')
      .max(2, 'lambdaWarningUnderBoost must be at most 2')
      .optional(),
    lambdaLimitUnderBoost: num('lambdaLimitUnderBoost')
      .min(0.5, 'lambdaLimitUnderBoost must be at least 0.5')
      .max(2, 'lambdaLimitUnderBoost must be at most 2')
      .optional(),
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

// ——— POST /api/compute ———

export const computeFuelSchema = z
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

export const computePointSchema = z.strictObject({
  rpm: rpm('rpm'),
  volumetricEfficiency: num('volumetric efficiency').gt(0, 'volumetric efficiency must be above 0').max(2, 'volumetric efficiency is a fraction, at most 2'),
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
export const computeResultPointSchema = z.strictObject({
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

// ——— the study input runStudy takes ———

/** A table by rpm: rows in strictly increasing rpm. */
export function rpmTableSchema(value: z.ZodNumber, what: string) {
  return z
    .array(z.strictObject({ rpm: rpm(`${what} rpm`), value }), { error: `${what} must be a list of { rpm, value } rows` })
    .min(1, `${what} needs at least one row`)
    .max(MAX_TABLE_ROWS, `${what} has at most ${MAX_TABLE_ROWS} rows`)
    .superRefine((rows, ctx) => {
      for (let i = 1; i < rows.length; i++) {
        if (isNum(rows[i].rpm) && isNum(rows[i - 1].rpm) && !(rows[i].rpm > rows[i - 1].rpm))
          ctx.addIssue({ code: 'custom', path: [i, 'rpm'], message: `${what} rows must be in increasing rpm` });
      }
    });
}

export const rpmPointsSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      kind: z.literal('list'),
      values: z
        .array(rpm())
        .min(1, 'give at least one rpm')
        .max(MAX_RPM_POINTS, `at most ${MAX_RPM_POINTS} rpm points`)
        .superRefine((values, ctx) => {
          for (let i = 1; i < values.length; i++)
            if (!(values[i] > values[i - 1])) ctx.addIssue({ code: 'custom', path: [i], message: 'rpm points must be in increasing order' });
        }),
    }),
    z
      .strictObject({
        kind: z.literal('range'),
        min: rpm('min'),
        max: rpm('max'),
        step: num('step').gt(0, 'step must be above 0 rpm').max(30_000, 'step must be at most 30 000 rpm'),
      })
      .superRefine((r, ctx) => {
        if (!(r.max >= r.min)) ctx.addIssue({ code: 'custom', path: ['max'], message: 'max must be at least min' });
        else if (rpmPointCount(r) > MAX_RPM_POINTS)
          ctx.addIssue({ code: 'custom', path: ['step'], message: `the range gives more than ${MAX_RPM_POINTS} points; use a larger step` });
      }),
  ],
  { error: 'rpm kind must be list or range' },
);

const engineLimitsSchema = z.strictObject({
  maxRpm: rpm('maxRpm').optional(),
  maxManifoldPressure: num('maxManifoldPressure')
    .gt(0, 'maxManifoldPressure is absolute, in Pa: above 0')
    .max(2_000_000, 'maxManifoldPressure must be at most 2 000 000 Pa')
    .optional(),
  maxCompressorOutletTemperature: temperature('maxCompressorOutletTemperature', 250, 700).optional(),
});

export const studyEngineSchema = z
  .strictObject({
    displacement: displacementSchema,
    cylinders: cylindersSchema,
    strokes: strokesSchema,
    rpm: rpmPointsSchema,
    volumetricEfficiency: rpmTableSchema(
      num('volumetric efficiency').gt(0, 'volumetric efficiency must be above 0').max(2, 'volumetric efficiency is a fraction, at most 2'),
      'volumetric efficiency',
    ),
    trappingEfficiency: fraction('trapping efficiency').optional(),
    limits: engineLimitsSchema.optional(),
  })
  .superRefine((e, ctx) => {
    if (e.trappingEfficiency !== undefined && e.strokes !== 2)
      ctx.addIssue({ code: 'custom', path: ['trappingEfficiency'], message: 'trapping efficiency applies only to a two-stroke engine' });
  });

export const fuelChoiceSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('petrol') }),
    z.strictObject({ kind: z.literal('ethanol-blend'), ethanolPercent: ethanolPercentSchema }),
    z.strictObject({ kind: z.literal('methanol') }),
  ],
  { error: 'fuel kind must be petrol, ethanol-blend or methanol' },
);

const injectorSetShape = {
  count: count('injector count', 32),
  ratingFluidDensity: num('rating fluid density')
    .min(500, 'rating fluid density is in kg/m³ (test fluids are about 680–780): at least 500')
    .max(1200, 'rating fluid density is in kg/m³: at most 1200')
    .optional(),
  deadTime: z
    .strictObject({
      time: num('dead time').min(0, 'dead time must be 0 s or more').max(0.005, 'dead time is in s (0.9 ms = 0.0009 s); at most 0.005 s'),
      voltage: num('dead time voltage')
        .min(6, 'dead time voltage is the battery voltage it was measured at, 6 to 30 V')
        .max(30, 'dead time voltage is the battery voltage it was measured at, 6 to 30 V'),
    })
    .optional(),
  ratedFlow: num('rated flow')
    .gt(0, 'rated flow must be above 0 m³/s')
    .max(2e-4, 'rated flow is per injector in m³/s (1000 cc/min = 1.667e-5 m³/s); at most 2e-4'),
  ratedPressure: num('rated pressure')
    // Injectors are rated at a few hundred kPa (common practice, no source); far below is a slip of units, and a pressure near 0 Pa would scale the flow to infinity.
    .min(10_000, 'rated pressure is in Pa (3 bar = 300 000 Pa); at least 10 000 Pa')
    .max(20_000_000, 'rated pressure must be at most 20 MPa'),
};

export const injectorsSchema = z.strictObject({
  primary: z.strictObject(injectorSetShape),
  secondary: z.strictObject({ ...injectorSetShape, switchOverRpm: rpm('switchOverRpm') }).optional(),
  fuelPressure: num('fuel pressure').gt(0, 'fuel pressure is gauge, in Pa: above 0').max(20_000_000, 'fuel pressure must be at most 20 MPa'),
  regulator: z.enum(['manifold-referenced', 'fixed-rail'], { error: 'regulator must be manifold-referenced or fixed-rail' }),
});

export const fuelSystemSchema = z.strictObject({
  fuel: fuelChoiceSchema,
  lambda: rpmTableSchema(lambdaSchema, 'lambda'),
  injectors: injectorsSchema,
  pumpFlowAvailable: num('pump flow')
    .gt(0, 'pump flow must be above 0 m³/s')
    .max(0.01, 'pump flow is in m³/s (255 L/h = 7.08e-5 m³/s); at most 0.01')
    .optional(),
});

export const powerSchema = z.discriminatedUnion(
  'basis',
  [
    z.strictObject({
      basis: z.literal('brake-thermal-efficiency'),
      brakeThermalEfficiency: fraction('brake thermal efficiency'),
      drivetrainLoss: drivetrainLossSchema,
    }),
    z.strictObject({ basis: z.literal('bsfc'), bsfc: bsfcSchema, drivetrainLoss: drivetrainLossSchema }),
  ],
  { error: 'power basis must be brake-thermal-efficiency or bsfc' },
);

export const lossesSchema = z.strictObject({
  inlet: inletLossInputSchema,
  chargeCooler: chargeCoolerLossInputSchema,
  inletTemperatureRise: num('inlet temperature rise')
    .min(0, 'inlet temperature rise must be 0 K or more')
    .max(100, 'inlet temperature rise must be at most 100 K')
    .optional(),
});

export const intercoolerSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('fixed'), manifoldTemperature: temperature('manifold temperature', 150, 600) }),
    z.strictObject({
      kind: z.literal('effectiveness'),
      effectiveness: num('effectiveness')
        .min(0, 'effectiveness is a fraction from 0 to 1')
        .max(1, 'effectiveness is a fraction from 0 to 1 (not a percentage)'),
      coolantTemperature: temperature('coolant temperature').optional(),
    }),
  ],
  { error: 'intercooler kind must be fixed or effectiveness' },
);

export const boostRowSchema = z
  .strictObject({
    label: name('label'),
    kind: z.enum(['full-load', 'gear', 'part-throttle'], { error: 'row kind must be full-load, gear or part-throttle' }),
    gear: count('gear', 12).optional(),
    boost: rpmTableSchema(boostSchema, 'boost'),
  })
  .superRefine((row, ctx) => {
    if (row.kind === 'gear' && row.gear === undefined) ctx.addIssue({ code: 'custom', path: ['gear'], message: 'a gear row needs its gear number' });
    if (row.kind !== 'gear' && row.gear !== undefined) ctx.addIssue({ code: 'custom', path: ['gear'], message: 'gear applies only to rows of kind gear' });
  });

export const scenarioSchema = z.strictObject({
  name: name('scenario name'),
  ambient: ambientSchema,
  boostSchedule: z
    .array(boostRowSchema)
    .min(1, 'a scenario needs at least one boost schedule row')
    .max(MAX_BOOST_ROWS, `at most ${MAX_BOOST_ROWS} boost schedule rows`),
});

/** The wastegates of one turbocharger. */
export const wastegatesSchema = z.strictObject({
  count: z.literal([1, 2], { error: 'wastegate count must be 1 or 2 (one gate, or one per scroll)' }),
  valveDiameter: num('wastegate valve diameter')
    .gt(0, 'wastegate valve diameter must be above 0 m')
    .max(0.1, 'wastegate valve diameter is in m (44 mm = 0.044 m); at most 0.1 m'),
  dischargeCoefficient: fraction('wastegate discharge coefficient'),
});

/** The exhaust side of a Plan (physics note §5); absent judges the Plan on the compressor alone. */
export const exhaustSchema = z
  .strictObject({
    housing: z.enum(['single', 'divided'], { error: 'housing must be single or divided' }),
    wastegates: wastegatesSchema,
    mechanicalEfficiency: fraction('mechanical efficiency'),
    turbineInletTemperature: rpmTableSchema(temperature('turbine inlet temperature', 400, 1500), 'turbine inlet temperature'),
    downstreamLoss: pressureLossSchema(downstreamLossSchema, 'downstream loss', 'exhaust'),
    pulseFactor: num('pulse factor')
      .gt(0, 'pulse factor multiplies turbine energy: above 0 (1.0 = no pulse gain)')
      .max(2, 'pulse factor must be at most 2')
      .optional(),
    turbineEfficiency: fraction('turbine efficiency').optional(),
  })
  .superRefine((e, ctx) => {
    if (e.housing === 'single' && e.pulseFactor !== undefined && e.pulseFactor !== 1)
      ctx.addIssue({ code: 'custom', path: ['pulseFactor'], message: 'the pulse factor applies only to a divided housing' });
  });

export const planSchema = z.strictObject({
  name: name('plan name'),
  turbochargers: count('turbochargers', 8),
  compressorEfficiency: fraction('compressor efficiency'),
  offMapEfficiency: fraction('off-map efficiency').optional(),
  maxShaftSpeed: num('max shaft speed').gt(0, 'max shaft speed must be above 0 rpm').max(500_000, 'max shaft speed must be at most 500 000 rpm').optional(),
  mapReference: mapReferenceSchema.optional(),
  exhaust: exhaustSchema.optional(),
});

export const studyInputSchema = z
  .strictObject({
    engine: studyEngineSchema,
    fuelSystem: fuelSystemSchema,
    power: powerSchema,
    losses: lossesSchema,
    intercooler: intercoolerSchema,
    scenarios: z.array(scenarioSchema).min(1, 'a study needs at least one scenario').max(MAX_SCENARIOS, `at most ${MAX_SCENARIOS} scenarios`),
    plans: z.array(planSchema).min(1, 'a study needs at least one plan').max(MAX_PLANS, `at most ${MAX_PLANS} plans`),
    requirements: requirementsSchema.optional(),
  })
  .superRefine((study, ctx) => {
    const seen = (list: { name: string }[], key: 'scenarios' | 'plans', what: string) => {
      const names = new Set<string>();
      list.forEach((item, i) => {
        if (names.has(item.name)) ctx.addIssue({ code: 'custom', path: [key, i, 'name'], message: `two ${what} are both named "${item.name}"` });
        names.add(item.name);
      });
    };
    seen(study.scenarios, 'scenarios', 'scenarios');
    seen(study.plans, 'plans', 'plans');
    const inlet = study.losses.inlet.pressureLoss;
    study.scenarios.forEach((s, si) => {
      const pAmb = ambientPressureOf(s.ambient);
      if (pAmb === null) return;
      if (isNum(inlet) && pAmb - inlet <= 0)
        ctx.addIssue({
          code: 'custom',
          path: ['losses', 'inlet', 'pressureLoss'],
          message: `inlet loss leaves no pressure at the compressor inlet in scenario "${s.name}" (ambient ${fmtKpa(pAmb)})`,
        });
      s.boostSchedule.forEach((row, ri) =>
        row.boost.forEach((r, k) => {
          if (!isNum(r.value)) return;
          const issue = manifoldPressureIssue(pAmb, r.value);
          if (issue) ctx.addIssue({ code: 'custom', path: ['scenarios', si, 'boostSchedule', ri, 'boost', k, 'value'], message: issue });
        }),
      );
    });
    if (study.power.basis === 'bsfc' && isNum(study.power.bsfc)) {
      const eta = 1 / (study.power.bsfc * fuelProperties(study.fuelSystem.fuel).lowerHeatingValue);
      if (!(eta <= 1))
        ctx.addIssue({ code: 'custom', path: ['power', 'bsfc'], message: 'bsfc is below what burning this fuel allows (brake thermal efficiency over 1)' });
    }
    const rows = study.scenarios.reduce((n, s) => n + s.boostSchedule.length, 0);
    const total = rows * study.plans.length * rpmPointCount(study.engine.rpm);
    if (total > MAX_STUDY_POINTS)
      ctx.addIssue({
        code: 'custom',
        path: ['engine', 'rpm'],
        message: `the study would compute ${total} points; at most ${MAX_STUDY_POINTS} (fewer rpm points, rows or plans)`,
      });
  });

/** A parsed study input is exactly what runStudy takes (checked by the compiler). */
export const studyInputSchemaMatchesType: z.output<typeof studyInputSchema> extends StudyInput ? true : false = true;
