import { runComputeRequest } from '#shared/compute/run';
import type { CompressorModel, CompressorReading, MapLocation, MapReference } from '#shared/matching/compressor/model';
import type { StudyInput } from '#shared/matching/input/study';
import type { OperatingPoint, PointValues } from '#shared/matching/result';
import { computeRequestSchema } from '#shared/schemas/compute';

/** 1650 cc/min in m³/s. */
export const CC_PER_MIN = 1e-6 / 60;

/** A small, invented study: a 2.0 L four-cylinder on petrol at sea level with one full-load row. */
export function baseStudy(): StudyInput {
  return {
    engine: {
      displacement: 0.002,
      cylinders: 4,
      strokes: 4,
      rpm: { kind: 'range', min: 2000, max: 7000, step: 1000 },
      volumetricEfficiency: [
        { rpm: 2000, value: 0.85 },
        { rpm: 5000, value: 0.98 },
        { rpm: 7000, value: 0.92 },
      ],
    },
    fuelSystem: {
      fuel: { kind: 'petrol' },
      lambda: [
        { rpm: 2000, value: 0.85 },
        { rpm: 7000, value: 0.8 },
      ],
      injectors: { primary: { count: 4, ratedFlow: 1000 * CC_PER_MIN, ratedPressure: 3e5 }, fuelPressure: 3e5, regulator: 'manifold-referenced' },
    },
    power: { basis: 'brake-thermal-efficiency', brakeThermalEfficiency: 0.33, drivetrainLoss: 0.12 },
    losses: { inlet: { pressureLoss: 2000 }, chargeCooler: { pressureLoss: 8000 } },
    intercooler: { kind: 'effectiveness', effectiveness: 0.7 },
    scenarios: [
      {
        name: 'Sea level',
        ambient: { pressure: 101_325, temperature: 298.15 },
        boostSchedule: [
          {
            label: 'Full load',
            kind: 'full-load',
            boost: [
              { rpm: 2000, value: 40_000 },
              { rpm: 4000, value: 120_000 },
            ],
          },
        ],
      },
    ],
    plans: [{ name: 'Plan A', turbochargers: 1, compressorEfficiency: 0.72 }],
  };
}

/** A study with a boost held constant over rpm (for properties). */
export function withBoost(study: StudyInput, boost: number): StudyInput {
  return {
    ...study,
    scenarios: study.scenarios.map((s) => ({ ...s, boostSchedule: [{ label: 'Row', kind: 'full-load', boost: [{ rpm: 1000, value: boost }] }] })),
  };
}

export interface FakeModelOptions {
  reference?: MapReference;
  maxSpeed?: number | null;
  /** Efficiency as a plane in corrected flow and pressure ratio: a + b·ṁc + c·PR. */
  plane?: { a: number; b: number; c: number };
  /** Surge line ṁc,surge = slope·(PR − 1), kg/s. */
  surgeSlope?: number;
  /** Choke limit, kg/s of corrected flow at every PR. */
  chokeFlow?: number;
  /** Highest pressure ratio the speed lines reach. */
  topPressureRatio?: number;
  /** Shaft speed as a plane in ṁc and PR, rpm: s0 + s1·ṁc + s2·(PR − 1). */
  speed?: { s0: number; s1: number; s2: number };
  /** Force every reading to this location (with nulls when not inside). */
  forceLocation?: MapLocation;
}

/**
 * A small invented compressor model for wiring tests: a straight surge line through PR 1, a
 * vertical choke limit, efficiency a plane in flow and pressure ratio, speed a plane too.
 */
export function fakeModel(options: FakeModelOptions = {}): CompressorModel & { reads: number } {
  const reference = options.reference ?? { temperature: 298.15, pressure: 100_000 };
  const plane = options.plane ?? { a: 0.6, b: 0.5, c: 0.02 };
  const surgeSlope = options.surgeSlope ?? 0.05;
  const chokeFlow = options.chokeFlow ?? 0.6;
  const top = options.topPressureRatio ?? 4;
  const speed = options.speed ?? { s0: 30_000, s1: 100_000, s2: 60_000 };
  const maxSpeed = options.maxSpeed === undefined ? 200_000 : options.maxSpeed;
  const model = {
    reference,
    maxSpeed,
    reads: 0,
    read(mc: number, pr: number): CompressorReading {
      model.reads++;
      const surgeFlow = surgeSlope * (pr - 1);
      let location: MapLocation = 'inside';
      if (options.forceLocation) location = options.forceLocation;
      else if (pr < 1.02) location = 'below-map';
      else if (pr > top) location = 'above-top-speed';
      else if (mc < surgeFlow) location = 'left-of-surge';
      else if (mc > chokeFlow) location = 'beyond-choke';
      const inside = location === 'inside';
      const shaftSpeed = inside ? speed.s0 + speed.s1 * mc + speed.s2 * (pr - 1) : null;
      return {
        efficiency: inside ? Math.min(0.82, Math.max(0.5, plane.a + plane.b * mc + plane.c * pr)) : null,
        shaftSpeed,
        surgeMargin: pr >= 1 ? (mc - surgeFlow) / mc : null,
        chokeMargin: (chokeFlow - mc) / mc,
        speedMargin: shaftSpeed !== null && maxSpeed !== null ? (maxSpeed - shaftSpeed) / maxSpeed : null,
        location,
      };
    },
  };
  return model;
}

/** Every number anywhere inside a value (for the no-NaN property). */
export function numbersIn(value: unknown, path = '', out: { path: string; value: number }[] = []): { path: string; value: number }[] {
  if (typeof value === 'number') out.push({ path, value });
  else if (Array.isArray(value)) value.forEach((v, i) => numbersIn(v, `${path}[${i}]`, out));
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) numbersIn(v, `${path}.${k}`, out);
  return out;
}

/** The values of a point the test expects solved (throws with its findings otherwise). */
export const solved = (p: OperatingPoint): PointValues => {
  if (!p.solved) throw new Error(`point at ${p.rpm} rpm not solved: ${p.findings.map((f) => f.message).join('; ')}`);
  return p.values;
};

/** One point through the compute contract: 2.0 L four-stroke, 6000 rpm, VE 0.90, 200 kPa abs, 320 K, petrol. */
export function computeAt(lambda: number, boost = 98_675) {
  const req = computeRequestSchema.parse({
    engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
    ambient: { pressure: 101_325, temperature: 293.15 },
    fuel: { kind: 'petrol', lambda, brakeThermalEfficiency: 0.3 },
    points: [{ rpm: 6000, volumetricEfficiency: 0.9, boost, manifoldTemperature: 320 }],
  });
  return runComputeRequest(req).points[0];
}
