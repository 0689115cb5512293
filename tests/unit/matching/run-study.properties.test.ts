import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { pointWorking } from '#shared/matching/explain-point';
import { runStudy } from '#shared/matching/run-study';
import { StudyInputError, parseStudyInput } from '#shared/schemas/study-input';
import type { AmbientInput } from '#shared/matching/input/ambient';
import type { CompressorModel, MapLocation } from '#shared/matching/compressor/model';
import type { IntercoolerInput } from '#shared/matching/input/intercooler';
import type { StudyInput } from '#shared/matching/input/study';
import { isaPressure } from '#shared/physics';
import { studyInputSchema } from '#shared/matching/input/study';
import { expectClose } from '../expect-close';
import { baseStudy, CC_PER_MIN, fakeModel, numbersIn, solved } from './fixtures';

const constantModel = (efficiency: number, reference: { temperature: number; pressure: number }): CompressorModel => ({
  reference,
  maxSpeed: null,
  read: () => ({ efficiency, shaftSpeed: null, surgeMargin: null, chokeMargin: null, speedMargin: null, location: 'inside' }),
});

// ——— generators of valid inputs ———
const temperatureArb = fc.double({ min: 250, max: 320, noNaN: true });
const ambientArb: fc.Arbitrary<AmbientInput> = fc.oneof(
  fc.record({ pressure: fc.double({ min: 60_000, max: 105_000, noNaN: true }), temperature: temperatureArb }),
  fc.record({ altitude: fc.double({ min: 0, max: 4000, noNaN: true }), temperature: temperatureArb }),
  fc.record({ altitude: fc.double({ min: 0, max: 4000, noNaN: true }) }),
);
const intercoolerArb: fc.Arbitrary<IntercoolerInput> = fc.oneof(
  fc.record({ kind: fc.constant('fixed' as const), manifoldTemperature: fc.double({ min: 290, max: 360, noNaN: true }) }),
  fc.record({ kind: fc.constant('effectiveness' as const), effectiveness: fc.double({ min: 0, max: 0.9, noNaN: true }) }),
);
/** One engine, one rpm, everything else varied: the setting of the physical properties. */
const pointSetting = fc.record({
  displacement: fc.double({ min: 0.0005, max: 0.008, noNaN: true }),
  strokes: fc.constantFrom(2 as const, 4 as const),
  rpm: fc.double({ min: 1000, max: 9000, noNaN: true }),
  ve: fc.double({ min: 0.6, max: 1.2, noNaN: true }),
  efficiency: fc.double({ min: 0.5, max: 0.85, noNaN: true }),
  turbochargers: fc.integer({ min: 1, max: 2 }),
  inlet: fc.double({ min: 0, max: 5000, noNaN: true }),
  chargeCooler: fc.double({ min: 0, max: 20_000, noNaN: true }),
  intercooler: intercoolerArb,
  ambient: ambientArb,
});
type Setting = typeof pointSetting extends fc.Arbitrary<infer T> ? T : never;

function studyOf(s: Setting, boost: number, ambient: AmbientInput = s.ambient): StudyInput {
  const study = baseStudy();
  study.engine = {
    ...study.engine,
    displacement: s.displacement,
    strokes: s.strokes,
    rpm: { kind: 'list', values: [s.rpm] },
    volumetricEfficiency: [{ rpm: 1000, value: s.ve }],
  };
  study.losses = { inlet: { pressureLoss: s.inlet }, chargeCooler: { pressureLoss: s.chargeCooler } };
  study.intercooler = s.intercooler;
  study.plans = [{ name: 'P', turbochargers: s.turbochargers, compressorEfficiency: s.efficiency }];
  study.scenarios = [{ name: 'S', ambient, boostSchedule: [{ label: 'R', kind: 'full-load', boost: [{ rpm: 1000, value: boost }] }] }];
  return study;
}
const pointOf = (study: StudyInput, models?: CompressorModel[]) => solved(runStudy(parseStudyInput(study), { compressorModels: models }).lines[0].points[0]);

describe('properties of the engine (fast-check)', () => {
  it('more boost gives more mass flow and a higher pressure ratio', () => {
    fc.assert(
      fc.property(pointSetting, fc.double({ min: 0, max: 200_000, noNaN: true }), fc.double({ min: 1000, max: 100_000, noNaN: true }), (s, boost, more) => {
        const a = pointOf(studyOf(s, boost));
        const b = pointOf(studyOf(s, boost + more));
        // Holds for compressor efficiency above (γ−1)/γ ≈ 0.286: the charge then densifies faster than it heats (isentropic relation).
        expect(b.massFlow).toBeGreaterThan(a.massFlow);
        expect(b.pressureRatio).toBeGreaterThan(a.pressureRatio); // p2/p1 rises with p2 (definition)
      }),
    );
  });

  it('higher altitude at the same manifold pressure gives a higher pressure ratio and corrected flow', () => {
    fc.assert(
      fc.property(
        pointSetting,
        fc.double({ min: 0, max: 3000, noNaN: true }),
        fc.double({ min: 100, max: 2000, noNaN: true }),
        fc.option(temperatureArb, { nil: undefined }),
        fc.double({ min: 5000, max: 200_000, noNaN: true }),
        (s, low, climb, temperature, overAmbient) => {
          const high = low + climb;
          const manifold = isaPressure(low) + overAmbient; // absolute, above ambient at both heights
          const at = (h: number) => pointOf(studyOf(s, manifold - isaPressure(h), temperature === undefined ? { altitude: h } : { altitude: h, temperature }));
          const a = at(low);
          const b = at(high);
          expectClose(b.manifoldPressure, a.manifoldPressure, 1e-9); // same manifold pressure (constructed)
          expect(b.pressureRatio).toBeGreaterThan(a.pressureRatio); // lower p1 (ISO 2533 pressure falls with height)
          expect(b.correctedMassFlow).toBeGreaterThan(a.correctedMassFlow); // ṁ·√(T1/Tref)·pref/p1 with lower p1 (definition)
        },
      ),
    );
  });

  it('corrected flow equals actual flow at the reference conditions', () => {
    fc.assert(
      fc.property(
        pointSetting,
        fc.double({ min: 0, max: 200_000, noNaN: true }),
        temperatureArb,
        fc.double({ min: 60_000, max: 105_000, noNaN: true }),
        (s, boost, tRef, pRef) => {
          const study = studyOf({ ...s, inlet: 0 }, boost, { pressure: pRef, temperature: tRef });
          study.plans[0].mapReference = { temperature: tRef, pressure: pRef };
          const v = pointOf(study);
          expectClose(v.correctedMassFlow, v.massFlow, 1e-12); // definition: √(Tref/Tref)/(pref/pref) = 1
        },
      ),
    );
  });

  it("two maps' reference conditions change corrected flow by exactly the ratio of the definition", () => {
    const reference = fc.record({ temperature: temperatureArb, pressure: fc.double({ min: 60_000, max: 105_000, noNaN: true }) });
    fc.assert(
      fc.property(pointSetting, fc.double({ min: 0, max: 200_000, noNaN: true }), reference, reference, (s, boost, refA, refB) => {
        const study = studyOf(s, boost);
        const a = pointOf(study, [constantModel(s.efficiency, refA)]);
        const b = pointOf(study, [constantModel(s.efficiency, refB)]);
        expectClose(a.massFlow, b.massFlow, 1e-12); // the same engine point
        expectClose(a.correctedMassFlow / b.correctedMassFlow, Math.sqrt(refB.temperature / refA.temperature) * (refA.pressure / refB.pressure), 1e-12); // definition of corrected flow
      }),
    );
  });

  // ——— whole studies: no NaN out, invalid in refused ———
  const tableArb = (min: number, max: number) =>
    fc
      .uniqueArray(fc.integer({ min: 500, max: 12_000 }), { minLength: 1, maxLength: 6 })
      .chain((rpms) => fc.tuple(...rpms.sort((x, y) => x - y).map((rpm) => fc.double({ min, max, noNaN: true }).map((value) => ({ rpm, value })))));
  const studyArb: fc.Arbitrary<StudyInput> = fc
    .record({
      setting: pointSetting,
      rpm: fc.oneof(
        fc
          .uniqueArray(fc.integer({ min: 300, max: 15_000 }), { minLength: 1, maxLength: 12 })
          .map((v) => ({ kind: 'list' as const, values: v.sort((x, y) => x - y) })),
        fc.record({
          kind: fc.constant('range' as const),
          min: fc.integer({ min: 500, max: 3000 }),
          max: fc.integer({ min: 3000, max: 12_000 }),
          step: fc.integer({ min: 250, max: 2000 }),
        }),
      ),
      ve: tableArb(0.05, 2),
      lambda: tableArb(0.5, 2),
      boost: tableArb(-40_000, 400_000),
      fuel: fc.oneof(
        fc.constant({ kind: 'petrol' as const }),
        fc.constant({ kind: 'methanol' as const }),
        fc.double({ min: 0, max: 100, noNaN: true }).map((e) => ({ kind: 'ethanol-blend' as const, ethanolPercent: e })),
      ),
      regulator: fc.constantFrom('manifold-referenced' as const, 'fixed-rail' as const),
      fuelPressure: fc.double({ min: 1e5, max: 6e5, noNaN: true }),
      injectorFlow: fc.double({ min: 100, max: 3000, noNaN: true }),
      staged: fc.boolean(),
      pump: fc.option(fc.double({ min: 1e-5, max: 5e-4, noNaN: true }), { nil: undefined }),
      power: fc.oneof(
        fc.record({
          basis: fc.constant('brake-thermal-efficiency' as const),
          brakeThermalEfficiency: fc.double({ min: 0.05, max: 1, noNaN: true }),
          drivetrainLoss: fc.double({ min: 0, max: 0.9, noNaN: true }),
        }),
        fc.record({
          basis: fc.constant('bsfc' as const),
          bsfc: fc.double({ min: 6e-8, max: 1e-6, noNaN: true }),
          drivetrainLoss: fc.double({ min: 0, max: 0.9, noNaN: true }),
        }),
      ),
      maxShaftSpeed: fc.option(fc.double({ min: 50_000, max: 300_000, noNaN: true }), { nil: undefined }),
    })
    .map(({ setting, rpm, ve, lambda, boost, fuel, regulator, fuelPressure, injectorFlow, staged, pump, power, maxShaftSpeed }) => {
      const study = studyOf(setting, 0);
      study.engine.rpm = rpm;
      study.engine.volumetricEfficiency = ve;
      study.engine.limits = { maxRpm: 9000, maxCompressorOutletTemperature: 450 };
      study.fuelSystem = {
        fuel,
        lambda,
        injectors: {
          primary: { count: 4, ratedFlow: injectorFlow * CC_PER_MIN, ratedPressure: 3e5 },
          ...(staged ? { secondary: { count: 4, ratedFlow: injectorFlow * CC_PER_MIN, ratedPressure: 3e5, switchOverRpm: 5000 } } : {}),
          fuelPressure,
          regulator,
        },
        ...(pump !== undefined ? { pumpFlowAvailable: pump } : {}),
      };
      study.power = power;
      study.scenarios[0].boostSchedule[0].boost = boost;
      study.plans[0] = { ...study.plans[0], ...(maxShaftSpeed !== undefined ? { maxShaftSpeed } : {}) };
      return study;
    });
  const locations: MapLocation[] = ['inside', 'left-of-surge', 'beyond-choke', 'above-top-speed', 'below-map', 'off-map'];
  const modelArb = fc.option(
    fc.oneof(
      fc
        .record({ surgeSlope: fc.double({ min: 0, max: 0.5, noNaN: true }), chokeFlow: fc.double({ min: 0.05, max: 1, noNaN: true }) })
        .map((o) => fakeModel(o)),
      fc.constantFrom(...locations).map((forceLocation) => fakeModel({ forceLocation })),
    ),
    { nil: undefined },
  );

  it('never lets NaN or Infinity out, in results or Working, for any valid input', () => {
    fc.assert(
      fc.property(studyArb, modelArb, (study, model) => {
        fc.pre(studyInputSchema.safeParse(study).success);
        const result = runStudy(parseStudyInput(study), { compressorModels: [model] });
        const bad = numbersIn(result).filter((n) => !Number.isFinite(n.value));
        expect(bad).toEqual([]); // design: no NaN or Infinity ever leaves the engine
        for (const line of result.lines)
          for (const point of line.points) {
            expect(point.solved).toBe(true); // a valid input always has a physical state
            const badWorking = numbersIn(pointWorking(line.context, point)).filter((n) => !Number.isFinite(n.value));
            expect(badWorking).toEqual([]);
          }
      }),
      { numRuns: 150 },
    );
  });

  const mutations: [string, (s: StudyInput) => void, string][] = [
    ['negative displacement', (s) => void (s.engine.displacement = -0.002), 'engine.displacement'],
    ['efficiency over 1', (s) => void (s.plans[0].compressorEfficiency = 1.2), 'plans.0.compressorEfficiency'],
    ['efficiency as percent', (s) => void (s.plans[0].compressorEfficiency = 72), 'plans.0.compressorEfficiency'],
    ['°C for kelvin', (s) => void (s.scenarios[0].ambient = { pressure: 101_325, temperature: 25 }), 'scenarios.0.ambient.temperature'],
    [
      'boost that empties the manifold',
      (s) => void (s.scenarios[0].boostSchedule[0].boost = [{ rpm: 1000, value: -199_000 }]),
      'scenarios.0.boostSchedule.0.boost.0.value',
    ],
    ['strokes 3', (s) => void ((s.engine as { strokes: number }).strokes = 3), 'engine.strokes'],
    ['empty rpm list', (s) => void (s.engine.rpm = { kind: 'list', values: [] }), 'engine.rpm.values'],
    ['too many rpm points', (s) => void (s.engine.rpm = { kind: 'range', min: 100, max: 20_000, step: 10 }), 'engine.rpm.step'],
    ['misspelt key', (s) => void ((s.engine as unknown as Record<string, unknown>).displacment = 0.002), 'engine'],
    ['NaN', (s) => void (s.engine.volumetricEfficiency = [{ rpm: 1000, value: Number.NaN }]), 'engine.volumetricEfficiency.0.value'],
    ['no plans', (s) => void (s.plans = []), 'plans'],
    [
      'rows out of order',
      (s) =>
        void (s.fuelSystem.lambda = [
          { rpm: 3000, value: 0.8 },
          { rpm: 2000, value: 0.9 },
        ]),
      'fuelSystem.lambda.1.rpm',
    ],
  ];

  it('refuses invalid input with a message naming the field', () => {
    fc.assert(
      fc.property(studyArb, fc.constantFrom(...mutations), (study, [, mutate, path]) => {
        fc.pre(studyInputSchema.safeParse(study).success);
        const bad = structuredClone(study);
        mutate(bad);
        let error: unknown;
        try {
          runStudy(parseStudyInput(bad));
        } catch (err) {
          error = err;
        }
        expect(error).toBeInstanceOf(StudyInputError); // design: invalid input is refused
        const issue = (error as StudyInputError).issues.find((i) => i.path === path);
        expect(issue, `issues: ${JSON.stringify((error as StudyInputError).issues)}`).toBeDefined(); // names the field
        expect(issue!.message.length).toBeGreaterThan(5); // with words
      }),
      { numRuns: 100 },
    );
  });
});
