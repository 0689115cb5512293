import type { ExhaustInput } from '#shared/matching/input/exhaust';
import type { StudyInput } from '#shared/matching/input/study';
import { baseStudy } from '../fixtures';

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
