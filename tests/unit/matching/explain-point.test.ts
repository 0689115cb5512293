import { describe, expect, it } from 'vitest';
import { computePointWorking, solveComputeRequest } from '#shared/compute/run';
import { pointWorking } from '#shared/matching/explain-point';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import type { OperatingLine, PointValues } from '#shared/matching/result';
import type { StudyInput } from '#shared/matching/input/study';
import type { WorkingStep } from '#shared/matching/working';
import { computeRequestSchema } from '#shared/schemas/compute';
import { math, siUnitOf } from '#shared/units';
import { baseStudy, CC_PER_MIN, fakeModel, withBoost } from './fixtures';

const kinds = new Set<string>([...Object.keys(siUnitOf), 'ratio', 'fraction', 'count', 'none']);

/** Symbols a formula reads (mathjs constants such as pi are allowed only where named here). */
function symbolsOf(formula: string): string[] {
  const names = new Set<string>();
  math.parse(formula).traverse((node, _path, parent) => {
    if (node.type === 'SymbolNode' && !(parent && parent.type === 'FunctionNode' && (parent as unknown as { fn: unknown }).fn === node))
      names.add((node as unknown as { name: string }).name);
  });
  return [...names].filter((n) => n !== 'pi');
}

function checkStep(s: WorkingStep): void {
  const scope = new Map<string, number>();
  for (const v of s.values) scope.set(v.symbol, v.value);
  // Every symbol the formula reads is shown among the values: nothing hidden, no mathjs constant slipped in.
  expect(
    symbolsOf(s.formula).filter((n) => !scope.has(n)),
    `${s.id}: ${s.formula}`,
  ).toEqual([]);
  const got = math.evaluate(s.formula, scope) as number;
  const rel = Math.abs(got - s.result.value) / Math.max(Math.abs(s.result.value), 1e-300);
  expect(rel, `${s.id}: ${s.formula} = ${got}, result ${s.result.value}`).toBeLessThan(1e-9); // the formula reproduces its result (mathjs as the evaluator)
  for (const v of [...s.values, s.result]) {
    expect(Number.isFinite(v.value), `${s.id}.${v.symbol}`).toBe(true);
    expect(kinds.has(v.kind), `${s.id}.${v.symbol} kind ${v.kind}`).toBe(true);
  }
  expect(s.title.length * s.explanation.length * s.source.length).toBeGreaterThan(0);
}

const resultOf: Record<string, keyof PointValues> = {
  'ambient-pressure': 'ambientPressure',
  'manifold-pressure': 'manifoldPressure',
  'pressure-ratio': 'pressureRatio',
  'manifold-temperature': 'manifoldTemperature',
  'manifold-density': 'airDensity',
  'engine-airflow': 'engineMassFlow',
  'turbocharger-share': 'massFlow',
  'corrected-flow': 'correctedMassFlow',
  'inlet-volume-flow': 'inletVolumeFlow',
  'outlet-temperature': 'compressorOutletTemperature',
  'compressor-power': 'compressorPower',
  'fuel-mass-flow': 'fuelMassFlow',
  'brake-power': 'brakePower',
  'wheel-power': 'wheelPower',
  torque: 'torque',
  'injector-duty': 'injectorDuty',
  'rail-pressure': 'railPressure',
};

function checkLines(lines: OperatingLine[]): number {
  let steps = 0;
  for (const line of lines)
    for (const point of line.points) {
      const working = pointWorking(line.context, point);
      expect(new Set(working.map((s) => s.id)).size).toBe(working.length); // ids unique within a point
      for (const s of working) {
        checkStep(s);
        const key = resultOf[s.id];
        // The Working shows the engine's own number; where the point is not reachable the engine gives none,
        // and the step is the estimate that placed the point (checked against its formula above).
        if (key && point.values && point.values[key] !== null) expect(s.result.value, `${s.id} vs ${key}`).toBeCloseTo(point.values[key] as number, 9);
      }
      if (point.values?.reachable === false) {
        // Nothing that follows from running at an unreachable point is worked out (design).
        expect(working.map((x) => x.id)).not.toEqual(expect.arrayContaining(['compressor-power']));
        expect(working.map((x) => x.id)).not.toEqual(expect.arrayContaining(['brake-power']));
        expect(working.find((x) => x.id === 'map-region')?.explanation).toMatch(/not reachable/);
      }
      steps += working.length;
    }
  return steps;
}

function variedStudy(): StudyInput {
  const study = baseStudy();
  study.engine.rpm = { kind: 'range', min: 1500, max: 8000, step: 500 };
  study.fuelSystem.fuel = { kind: 'ethanol-blend', ethanolPercent: 85 };
  study.fuelSystem.injectors = {
    primary: { count: 4, ratedFlow: 1000 * CC_PER_MIN, ratedPressure: 3e5, ratingFluidDensity: 700, deadTime: { time: 0.0009, voltage: 14 } },
    secondary: { count: 4, ratedFlow: 800 * CC_PER_MIN, ratedPressure: 4e5, switchOverRpm: 5000, deadTime: { time: 0.0011, voltage: 13.5 } },
    fuelPressure: 4e5,
    regulator: 'fixed-rail',
  };
  study.fuelSystem.pumpFlowAvailable = 1e-4;
  study.power = { basis: 'bsfc', bsfc: 1.1e-7, drivetrainLoss: 0.15 };
  // Losses at a stated flow: they follow the flow as ṁ²/ρ.
  study.losses = {
    inlet: { pressureLoss: 3000, referenceMassFlow: 0.2 },
    chargeCooler: { pressureLoss: 12_000, referenceMassFlow: 0.2, referenceDensity: 2.2 },
    inletTemperatureRise: 8,
  };
  study.scenarios.push({
    name: 'High',
    ambient: { altitude: 2500, temperature: 303.15, relativeHumidity: 0.6 },
    boostSchedule: [
      {
        label: 'Part',
        kind: 'part-throttle',
        boost: [
          { rpm: 1500, value: -30_000 },
          { rpm: 8000, value: 20_000 },
        ],
      },
      {
        label: 'Full',
        kind: 'full-load',
        boost: [
          { rpm: 1500, value: 60_000 },
          { rpm: 4000, value: 180_000 },
        ],
      },
    ],
  });
  study.plans.push({
    name: 'Twin',
    turbochargers: 2,
    compressorEfficiency: 0.7,
    maxShaftSpeed: 150_000,
    mapReference: { temperature: 293.15, pressure: 98_000 },
  });
  return study;
}

describe('the Working', () => {
  it('has formulas that reproduce every result, for petrol, pressure ambient and effectiveness cooling', () => {
    expect(checkLines(runStudy(parseStudyInput(baseStudy())).lines)).toBeGreaterThan(100);
  });

  it('does the same for E85, ISA altitude, staged fixed-rail injectors, BSFC, throttled points and a map', () => {
    const study = variedStudy();
    expect(checkLines(runStudy(parseStudyInput(study)).lines)).toBeGreaterThan(1000);
    expect(checkLines(runStudy(parseStudyInput(study), { compressorModels: [fakeModel(), fakeModel({ surgeSlope: 0.4 })] }).lines)).toBeGreaterThan(1000);
    study.intercooler = { kind: 'fixed', manifoldTemperature: 315 };
    study.fuelSystem.fuel = { kind: 'methanol' };
    expect(checkLines(runStudy(parseStudyInput(study), { compressorModels: [fakeModel()] }).lines)).toBeGreaterThan(1000);
  });

  it('works out humid air, losses at a flow, a two-stroke’s trapped air and the injectors’ dead time, each step with its source', () => {
    const study = variedStudy();
    study.engine.strokes = 2;
    study.engine.trappingEfficiency = 0.75;
    expect(checkLines(runStudy(parseStudyInput(study), { compressorModels: [fakeModel(), fakeModel()] }).lines)).toBeGreaterThan(1000);
    const line = runStudy(parseStudyInput(study)).lines.find((l) => l.scenarioName === 'High' && l.rowLabel === 'Full')!;
    const ids = pointWorking(line.context, line.points[8]).map((s) => s.id);
    for (const id of [
      'humidity-ratio',
      'humid-gas-constant',
      'humid-cp',
      'humid-gamma',
      'inlet-loss',
      'charge-cooler-loss',
      'dry-air-flow',
      'trapped-air',
      'injection-period',
      'injector-duty',
    ])
      expect(ids, id).toContain(id);
    const steps = pointWorking(line.context, line.points[8]);
    expect(steps.find((s) => s.id === 'humidity-ratio')!.source).toMatch(/ASHRAE Handbook Fundamentals 2017/);
    expect(steps.find((s) => s.id === 'trapped-air')!.source).toMatch(/Heywood.*§6\.6/);
    expect(steps.find((s) => s.id === 'inlet-loss')!.formula).toMatch(/\^ 2/);
  });

  it('names the interpolation and the hold in the table steps', () => {
    const line = runStudy(parseStudyInput(baseStudy())).lines[0];
    const boostAt = (i: number) => pointWorking(line.context, line.points[i]).find((s) => s.id === 'boost')!;
    expect(boostAt(1).formula).toBe('y_0 + (y_1 - y_0) * (N - N_0) / (N_1 - N_0)'); // 3000 rpm: between rows
    expect(boostAt(5).explanation).toMatch(/held flat/); // 7000 rpm: past the last row
  });

  it('covers single points of the compute contract', () => {
    const req = computeRequestSchema.parse({
      engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
      ambient: { altitude: 1000 },
      losses: { inlet: 1500, chargeCooler: 5000 },
      fuel: { kind: 'ethanol-blend', ethanolPercent: 30, lambda: 0.85, brakeThermalEfficiency: 0.32, drivetrainLoss: 0.1 },
      points: [{ rpm: 6000, volumetricEfficiency: 0.95, boost: 100_000, manifoldTemperature: 320 }],
    });
    const { context, points } = solveComputeRequest(req);
    const working = computePointWorking(context, points[0]);
    working.forEach(checkStep);
    expect(working.find((s) => s.id === 'manifold-temperature')?.source).toMatch(/Given/); // fixed per point
  });

  it('stays finite for a point that cannot be solved', () => {
    const study = withBoost(baseStudy(), -150_000);
    const line = runStudy(study).lines[0];
    const working = pointWorking(line.context, line.points[0]);
    working.forEach(checkStep);
    expect(working.map((s) => s.id)).toContain('boost'); // shows the input that made it impossible
  });
});
