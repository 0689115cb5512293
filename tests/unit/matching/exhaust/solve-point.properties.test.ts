import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { turbineModelFromMap } from '#shared/maps';
import { fakeModel, numbersIn } from '../fixtures';
import { pointWorking } from '#shared/matching/explain-point';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import type { ExhaustInput } from '#shared/matching/input/exhaust';
import type { OperatingPoint } from '#shared/matching/result';
import { demoTurbine, scaledTurbine } from '#tests/unit/maps/helpers';
import { exhaustOf, exhaustStudy } from './fixtures';

const turbineMaps = [demoTurbine('ar064-single'), demoTurbine('ar082-single'), demoTurbine('ar064-divided'), demoTurbine('ar082-divided')];

const exhaustArb: fc.Arbitrary<ExhaustInput> = fc
  .record({
    divided: fc.boolean(),
    gates: fc.constantFrom(1 as const, 2 as const),
    valveDiameter: fc.double({ min: 0.005, max: 0.1, noNaN: true }),
    dischargeCoefficient: fc.double({ min: 0.3, max: 1, noNaN: true }),
    mechanicalEfficiency: fc.double({ min: 0.5, max: 1, noNaN: true }),
    t3Low: fc.double({ min: 400, max: 1500, noNaN: true }),
    t3High: fc.double({ min: 400, max: 1500, noNaN: true }),
    downstreamLoss: fc.double({ min: 0, max: 200_000, noNaN: true }),
    // Absent: the loss is the same at every flow; given: it follows the exhaust flow as ṁ²/ρ.
    downstreamReference: fc.option(
      fc.record({ flow: fc.double({ min: 0.01, max: 5, noNaN: true }), density: fc.double({ min: 0.06, max: 20, noNaN: true }) }),
      { nil: undefined },
    ),
    pulseFactor: fc.double({ min: 0.5, max: 2, noNaN: true }),
  })
  .map((r) =>
    exhaustOf({
      housing: r.divided ? 'divided' : 'single',
      wastegates: { count: r.gates, valveDiameter: r.valveDiameter, dischargeCoefficient: r.dischargeCoefficient },
      mechanicalEfficiency: r.mechanicalEfficiency,
      turbineInletTemperature: [
        { rpm: 2000, value: r.t3Low },
        { rpm: 7000, value: r.t3High },
      ],
      downstreamLoss: r.downstreamReference
        ? { pressureLoss: r.downstreamLoss, referenceMassFlow: r.downstreamReference.flow, referenceDensity: r.downstreamReference.density }
        : { pressureLoss: r.downstreamLoss },
      ...(r.divided ? { pulseFactor: r.pulseFactor } : {}),
    }),
  );

const finite = (points: OperatingPoint[]) => {
  const bad = numbersIn(points).filter((n) => !Number.isFinite(n.value));
  expect(bad, JSON.stringify(bad.slice(0, 3))).toEqual([]);
};

describe('the exhaust side never lets NaN or Infinity out (fast-check)', () => {
  it('for any valid exhaust block, turbine size, boost, altitude and compressor map', () => {
    fc.assert(
      fc.property(
        exhaustArb,
        fc.constantFrom(...turbineMaps),
        fc.double({ min: 0.1, max: 5, noNaN: true }),
        fc.double({ min: -60_000, max: 400_000, noNaN: true }),
        fc.double({ min: 0, max: 4000, noNaN: true }),
        fc.boolean(),
        fc.integer({ min: 1, max: 2 }),
        (exhaust, map, scale, boost, altitude, withMap, turbochargers) => {
          const study = exhaustStudy([exhaust]);
          study.engine.rpm = { kind: 'list', values: [1500, 3000, 5000, 7500] };
          study.plans[0].turbochargers = turbochargers;
          study.scenarios[0].ambient = { altitude };
          study.scenarios[0].boostSchedule[0].boost = [
            { rpm: 1500, value: boost / 2 },
            { rpm: 5000, value: boost },
          ];
          const result = runStudy(parseStudyInput(study), {
            compressorModels: withMap ? [fakeModel()] : [],
            turbineModels: [turbineModelFromMap(scaledTurbine(map, scale))],
          });
          const line = result.lines[0];
          finite(line.points);
          for (const p of line.points) {
            expect(numbersIn(pointWorking(line.context, p)).every((n) => Number.isFinite(n.value))).toBe(true);
            const v = p.values;
            if (!v || v.exhaustCase === null) continue;
            // A point the compressor cannot deliver shows no exhaust results (only where it sits).
            if (!v.reachable) {
              expect(v.turbinePower).toBeNull();
              continue;
            }
            // Mass is conserved and the gates never take more than all of it (mass balance).
            expect(Math.abs(v.turbineMassFlow! + v.wastegateMassFlow! - v.exhaustMassFlow!)).toBeLessThanOrEqual(1e-9 * v.exhaustMassFlow!);
            expect(v.expansionRatio!).toBeGreaterThanOrEqual(1);
            expect(v.boost).toBeLessThanOrEqual(v.boostTarget!);
          }
          expect(numbersIn(line.exhaust).every((n) => Number.isFinite(n.value))).toBe(true);
        },
      ),
      { numRuns: 150 },
    );
  });
});
