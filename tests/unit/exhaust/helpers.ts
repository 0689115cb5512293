import { readFileSync } from 'node:fs';
import { expect } from 'vitest';
import { parseMapFile } from '#shared/maps';
import type { CompressorMap, TurbineMap } from '#shared/maps/types';
import type { ExhaustInput, OperatingPoint, PointValues, StudyInput } from '#shared/matching';
import { baseStudy } from '../matching/fixtures';

/** Relative closeness: |actual − expected| ≤ relTol·|expected| (absolute when expected is 0). */
export function expectClose(actual: number | null | undefined, expected: number, relTol: number, what = ''): void {
  expect(typeof actual, `${what} is a number`).toBe('number');
  const scale = expected === 0 ? 1 : Math.abs(expected);
  const err = Math.abs((actual as number) - expected) / scale;
  expect(err, `${what} ${actual} should be within ${relTol} (relative) of ${expected}`).toBeLessThanOrEqual(relTol);
}

function demoMap(file: string) {
  const parsed = parseMapFile(readFileSync(new URL(`../../../data/maps/${file}.csv`, import.meta.url), 'utf8'));
  if (!parsed.ok) throw new Error(`demo map ${file} did not read`);
  return parsed.map;
}

/** One of the invented demo turbine maps of data/maps. */
export function demoTurbine(name: 'ar064-single' | 'ar064-divided' | 'ar082-single' | 'ar082-divided'): TurbineMap {
  const map = demoMap(`turbine-t64-${name}`);
  if (map.kind !== 'turbine') throw new Error('not a turbine map');
  return map;
}

/** One of the invented demo compressor maps of data/maps. */
export function demoCompressor(name: 's44' | 'm58' | 'l76'): CompressorMap {
  const map = demoMap(`compressor-${name}`);
  if (map.kind !== 'compressor') throw new Error('not a compressor map');
  return map;
}

/** A turbine map with every flow parameter scaled (a bigger or smaller housing of the same invented wheel). */
export function scaledTurbine(map: TurbineMap, factor: number, change: Partial<Pick<TurbineMap, 'housing' | 'scrollFeed' | 'name'>> = {}): TurbineMap {
  return {
    ...map,
    ...change,
    curves: map.curves.map((c) => ({ ...c, points: c.points.map((p) => ({ ...p, flowParameter: p.flowParameter * factor })) })),
  };
}

/** An invented exhaust side: T3 rising with rpm, one 40 mm gate, a 15 kPa downpipe loss. */
export function exhaustOf(change: Partial<ExhaustInput> = {}): ExhaustInput {
  return {
    housing: 'single',
    wastegates: { count: 1, valveDiameter: 0.04, dischargeCoefficient: 0.8 },
    mechanicalEfficiency: 0.95,
    turbineInletTemperature: [
      { rpm: 2000, value: 1000 },
      { rpm: 7000, value: 1170 },
    ],
    downstreamLoss: { pressureLoss: 15_000 },
    ...change,
  };
}

/** The matching fixture's small study, at finer rpm steps, with a boost target that asks a lot early. */
export function exhaustStudy(exhausts: ExhaustInput[]): StudyInput {
  const study = baseStudy();
  study.engine.rpm = { kind: 'range', min: 2000, max: 7000, step: 100 };
  study.scenarios[0].boostSchedule[0].boost = [
    { rpm: 2000, value: 60_000 },
    { rpm: 3500, value: 130_000 },
    { rpm: 7000, value: 130_000 },
  ];
  study.plans = exhausts.map((exhaust, i) => ({ name: `Plan ${i + 1}`, turbochargers: 1, compressorEfficiency: 0.72, exhaust }));
  return study;
}

export const solved = (p: OperatingPoint): PointValues => {
  if (!p.solved) throw new Error(`point at ${p.rpm} rpm not solved: ${p.findings.map((f) => f.message).join('; ')}`);
  return p.values;
};
