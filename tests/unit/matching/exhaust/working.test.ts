import { describe, expect, it } from 'vitest';
import { compressorModelFromMap, turbineModelFromMap } from '#shared/maps';
import { pointWorking } from '#shared/matching/explain-point';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import type { PointValues } from '#shared/matching/result';
import type { WorkingStep } from '#shared/matching/working';
import { math } from '#shared/units';
import { demoCompressor, demoTurbine, scaledTurbine } from '#tests/unit/maps/helpers';
import { exhaustOf, exhaustStudy } from './fixtures';

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
  expect(
    symbolsOf(s.formula).filter((n) => !scope.has(n)),
    `${s.id}: ${s.formula}`,
  ).toEqual([]); // nothing hidden
  const got = math.evaluate(s.formula, scope) as number;
  const rel = Math.abs(got - s.result.value) / Math.max(Math.abs(s.result.value), 1e-300);
  expect(rel, `${s.id}: ${s.formula} = ${got}, result ${s.result.value}`).toBeLessThan(1e-9); // the formula reproduces its result (mathjs as the evaluator)
  for (const v of [...s.values, s.result]) expect(Number.isFinite(v.value), `${s.id}.${v.symbol}`).toBe(true);
}

const resultOf: Record<string, keyof PointValues> = {
  'exhaust-mass-flow': 'exhaustMassFlow',
  'turbine-inlet-temperature': 'turbineInletTemperature',
  'turbine-outlet-pressure': 'turbineOutletPressure',
  'shut-gate-expansion-ratio': 'shutGateExpansionRatio',
  'shut-gate-turbine-power': 'shutGateTurbinePower',
  'expansion-ratio': 'expansionRatio',
  'turbine-inlet-pressure': 'turbineInletPressure',
  'drive-pressure-ratio': 'drivePressureRatio',
  'turbine-flow-parameter': 'turbineFlowParameter',
  'turbine-mass-flow': 'turbineMassFlow',
  'turbine-power': 'turbinePower',
  'wastegate-mass-flow': 'wastegateMassFlow',
  'wastegate-fraction': 'wastegateFraction',
  'wastegate-diameter-needed': 'wastegateDiameterNeeded',
  'wastegate-margin': 'wastegateMargin',
  'boost-held': 'boost',
  'manifold-pressure': 'manifoldPressure',
  'compressor-power': 'compressorPower',
};

describe('the Working of the exhaust side', () => {
  it('has formulas that reproduce every result and show the engine’s own numbers, in every case', () => {
    const study = exhaustStudy([
      exhaustOf(),
      exhaustOf({ housing: 'divided', pulseFactor: 1.1, wastegates: { count: 2, valveDiameter: 0.03, dischargeCoefficient: 0.75 } }),
      exhaustOf({ wastegates: { count: 1, valveDiameter: 0.01, dischargeCoefficient: 0.8 } }),
    ]);
    study.scenarios.push({
      name: 'Part',
      ambient: { altitude: 1200 },
      boostSchedule: [{ label: 'Half', kind: 'part-throttle', boost: [{ rpm: 2000, value: -30_000 }] }],
    });
    const c = compressorModelFromMap(demoCompressor('m58'));
    const turbines = [
      turbineModelFromMap(demoTurbine('ar064-single')),
      turbineModelFromMap(demoTurbine('ar082-divided')),
      turbineModelFromMap(scaledTurbine(demoTurbine('ar064-single'), 0.3)),
    ];
    const result = runStudy(parseStudyInput(study), { compressorModels: [c, c, c], turbineModels: turbines });
    const seen = new Set<string>();
    for (const line of result.lines)
      for (const point of line.points) {
        const working = pointWorking(line.context, point);
        expect(new Set(working.map((s) => s.id)).size).toBe(working.length); // ids unique within a point
        for (const s of working) {
          checkStep(s);
          seen.add(s.id);
          const key = resultOf[s.id];
          if (key && point.values) expect(s.result.value, `${s.id} vs ${key}`).toBeCloseTo(point.values[key] as number, 9);
        }
      }
    // Every step of the three cases and of the gate sizing appeared somewhere.
    for (const id of [
      'boost-held',
      'shut-gate-drive-power',
      'power-balance',
      'wastegate-pressure-ratio',
      'wastegate-mass-flux',
      'wastegate-area-needed',
      'wastegate-margin',
      'turbine-power',
    ])
      expect(seen.has(id), id).toBe(true);
  });

  it('shows the target, then the boost the turbine holds, where it cannot hold the target', () => {
    const c = compressorModelFromMap(demoCompressor('m58'));
    const line = runStudy(parseStudyInput(exhaustStudy([exhaustOf()])), {
      compressorModels: [c],
      turbineModels: [turbineModelFromMap(demoTurbine('ar082-single'))],
    }).lines[0];
    const working = pointWorking(line.context, line.points[0]);
    const target = working.find((s) => s.id === 'boost')!;
    const held = working.find((s) => s.id === 'boost-held')!;
    expect(target.result.symbol).toBe('boost_target');
    expect(target.result.value).toBe(60_000); // the schedule's first row (fixture)
    expect(held.result.symbol).toBe('boost');
    expect(working.indexOf(held)).toBe(working.indexOf(target) + 1);
  });
});
