import { describe, expect, it } from 'vitest';
import { REQUIREMENT_DEFAULTS } from '#shared/matching/input/requirements';
import { INJECTOR_DUTY_LIMIT, INJECTOR_DUTY_WARNING } from '#shared/matching/findings';
import { runStudy } from '#shared/matching/run-study';
import { StudyInputError, parseStudyInput } from '#shared/schemas/study-input';
import type { OperatingPoint } from '#shared/matching/result';
import type { StudyInput } from '#shared/matching/input/study';
import { expectClose } from '../expect-close';
import { baseStudy, CC_PER_MIN, solved, withBoost } from './fixtures';

const codes = (p: OperatingPoint) => p.findings.map((f) => f.code);

describe('a whole study', () => {
  it('returns one line per plan × scenario × boost row, in that order', () => {
    const study = baseStudy();
    study.plans.push({ name: 'Plan B', turbochargers: 2, compressorEfficiency: 0.7 });
    study.scenarios.push({
      name: 'Hot, high',
      ambient: { altitude: 2000, temperature: 308.15 },
      boostSchedule: [
        { label: 'Gear 1', kind: 'gear', gear: 1, boost: [{ rpm: 2000, value: 50_000 }] },
        { label: 'Gear 2', kind: 'gear', gear: 2, boost: [{ rpm: 2000, value: 90_000 }] },
      ],
    });
    const { lines } = runStudy(parseStudyInput(study));
    expect(lines.map((l) => `${l.planName}/${l.scenarioName}/${l.rowLabel}`)).toEqual([
      'Plan A/Sea level/Full load',
      'Plan A/Hot, high/Gear 1',
      'Plan A/Hot, high/Gear 2',
      'Plan B/Sea level/Full load',
      'Plan B/Hot, high/Gear 1',
      'Plan B/Hot, high/Gear 2',
    ]); // design: plans × scenarios × rows
    expect(lines[0].points.map((p) => p.rpm)).toEqual([2000, 3000, 4000, 5000, 6000, 7000]); // the rpm range 2000–7000 step 1000
    expect(lines[2].gear).toBe(2); // as given
  });

  it('holds boost flat past the table and reads VE and lambda by rpm', () => {
    const line = runStudy(parseStudyInput(baseStudy())).lines[0];
    const at = (rpm: number) => solved(line.points.find((p) => p.rpm === rpm)!);
    expect(at(7000).boost).toBe(120_000); // last row held flat (design)
    expect(at(3000).boost).toBe(80_000); // midway 40 → 120 kPa (linear interpolation)
    expectClose(at(3000).volumetricEfficiency, 0.85 + (0.98 - 0.85) / 3, 1e-12); // linear interpolation 2000 → 5000 rpm
    expectClose(at(7000).lambda!, 0.8, 1e-12); // last row (as given)
  });

  it('refuses invalid input with the field named', () => {
    const study = baseStudy();
    study.engine.displacement = -0.002;
    expect(() => runStudy(parseStudyInput(study))).toThrow(StudyInputError);
    try {
      runStudy(parseStudyInput(study));
    } catch (err) {
      expect((err as StudyInputError).issues[0].path).toBe('engine.displacement'); // names the field
      expect((err as Error).message).toMatch(/engine\.displacement/); // in the message too
    }
  });

  it('turns an impossible state into a finding when validation is skipped, never NaN', () => {
    const study = withBoost(baseStudy(), -150_000); // manifold at −48.7 kPa absolute
    const point = runStudy(study).lines[0].points[0];
    expect(point.solved).toBe(false); // no physical state (definition)
    expect(point.findings[0]).toMatchObject({ code: 'unsolvable', severity: 'limit' });
    expect(point.findings[0].message).toMatch(/not positive/);
  });

  it('takes the compressor at PR 1 when throttled', () => {
    const v = solved(runStudy(parseStudyInput(withBoost(baseStudy(), -40_000))).lines[0].points[0]);
    expect(v.throttled).toBe(true); // manifold 61 kPa < inlet 99 kPa
    expect(v.pressureRatio).toBe(1); // design: the throttle takes the drop
    expect(v.compressorPower).toBe(0); // no compression, no power (definition)
    expect(codes(runStudy(parseStudyInput(withBoost(baseStudy(), -40_000))).lines[0].points[0])).toContain('throttled');
  });

  it('opens the secondary injectors from the switch-over rpm', () => {
    const study = baseStudy();
    study.fuelSystem.injectors.secondary = { count: 4, ratedFlow: 1000 * CC_PER_MIN, ratedPressure: 3e5, switchOverRpm: 4500 };
    const line = runStudy(parseStudyInput(study)).lines[0];
    const [low, high] = [solved(line.points[2]), solved(line.points[3])]; // 4000 and 5000 rpm
    expect(low.injectorStage).toBe('primary'); // below switch-over (design)
    expect(high.injectorStage).toBe('both'); // at and above switch-over (design)
    expectClose(high.injectorCapacity!, 8 * 1000 * CC_PER_MIN, 1e-12); // 8 × 1000 cc/min at the rated ΔP (1:1 regulator)
    expectClose(low.injectorCapacity!, 4 * 1000 * CC_PER_MIN, 1e-12); // 4 × 1000 cc/min
  });

  it('loses injector flow to boost on a fixed rail, and flags no flow when boost reaches the rail', () => {
    const study = withBoost(baseStudy(), 150_000);
    study.fuelSystem.injectors.regulator = 'fixed-rail';
    const v = solved(runStudy(parseStudyInput(study)).lines[0].points[0]);
    expectClose(v.injectorPressureDifference!, 150_000, 1e-12); // 300 − 150 kPa (definition)
    expectClose(v.injectorCapacity!, 4 * 1000 * CC_PER_MIN * Math.sqrt(0.5), 1e-12); // √ΔP relation
    study.fuelSystem.injectors.fuelPressure = 150_000;
    const none = runStudy(parseStudyInput(study)).lines[0].points[0];
    expect(solved(none).injectorDuty).toBeNull(); // no pressure difference, no duty (definition)
    expect(none.findings.find((f) => f.code === 'injector-no-flow')?.severity).toBe('limit'); // design
  });

  function dutyStudy(targetDuty: number): StudyInput {
    const study = withBoost(baseStudy(), 100_000);
    study.engine.rpm = { kind: 'list', values: [5000] };
    const v = solved(runStudy(parseStudyInput(study)).lines[0].points[0]);
    const perInjector = v.fuelVolumeFlow! / 4 / targetDuty;
    study.fuelSystem.injectors.primary.ratedFlow = perInjector;
    return study;
  }

  it('grades injector duty: warning over 80 %, limit over 85 %, saturated at 100 %', () => {
    const finding = (duty: number) => runStudy(parseStudyInput(dutyStudy(duty))).lines[0].points[0].findings.find((f) => f.code.startsWith('injector'));
    expect(finding(0.78)).toBeUndefined(); // under 80 % (common practice, no source)
    expect(finding(0.82)).toMatchObject({ code: 'injector-duty-high', severity: 'warning', threshold: INJECTOR_DUTY_WARNING }); // 80 %, common practice
    expect(finding(0.9)).toMatchObject({ code: 'injector-duty-limit', severity: 'limit', threshold: INJECTOR_DUTY_LIMIT }); // 85 %, common practice
    expect(finding(1.2)).toMatchObject({ code: 'injector-saturated', severity: 'limit' }); // 100 %: open all the time (definition)
  });

  it('flags a fuel pump that is short or nearly so', () => {
    const study = dutyStudy(0.5);
    const v = solved(runStudy(parseStudyInput(study)).lines[0].points[0]);
    study.fuelSystem.pumpFlowAvailable = v.pumpFlowRequired! / 0.95;
    expect(codes(runStudy(parseStudyInput(study)).lines[0].points[0])).toContain('fuel-pump-near-limit'); // 95 % of the pump (over 90 %, common practice)
    study.fuelSystem.pumpFlowAvailable = v.pumpFlowRequired! / 1.05;
    expect(runStudy(parseStudyInput(study)).lines[0].points[0].findings.find((f) => f.code === 'fuel-pump-short')?.severity).toBe('limit'); // needs more than the pump gives
  });

  it('warns above 200 °C compressor outlet temperature, and calls the stated limit a limit', () => {
    const study = withBoost(baseStudy(), 250_000); // PR ≈ 3.6 at η 0.72: T2 ≈ 480 K
    study.engine.rpm = { kind: 'list', values: [5000] };
    const p = runStudy(parseStudyInput(study)).lines[0].points[0];
    expect(solved(p).compressorOutletTemperature).toBeGreaterThan(REQUIREMENT_DEFAULTS.maxCompressorOutletTemperature); // 200 °C, from memory
    expect(p.findings.find((f) => f.code === 'compressor-outlet-temperature-high')?.severity).toBe('warning');
    study.engine.limits = { maxCompressorOutletTemperature: 453.15 };
    expect(runStudy(parseStudyInput(study)).lines[0].points[0].findings.find((f) => f.code === 'compressor-outlet-temperature-limit')?.severity).toBe('limit'); // stated limit 180 °C
  });

  it('flags the engine limits and odd inputs', () => {
    const study = baseStudy();
    study.engine.limits = { maxRpm: 6500, maxManifoldPressure: 200_000 };
    study.engine.volumetricEfficiency = [{ rpm: 2000, value: 1.5 }];
    study.scenarios[0].ambient = { pressure: 101_325, temperature: 338.15 };
    const line = runStudy(parseStudyInput(study)).lines[0];
    expect(codes(line.points[5])).toEqual(expect.arrayContaining(['rpm-limit', 'manifold-pressure-limit', 'input-out-of-range'])); // 7000 > 6500 rpm; 221 > 200 kPa; VE 150 %
    expect(line.points[0].findings.filter((f) => f.message.startsWith('Ambient temperature'))).toHaveLength(1); // 65 °C > 60 °C (from memory), once per line
    expect(line.points[1].findings.filter((f) => f.message.startsWith('Ambient temperature'))).toHaveLength(0); // only at the first point
    expect(line.worstSeverity).toBe('limit'); // the worst of the line
  });

  it('attaches Working to every point when asked, and not otherwise', () => {
    expect(runStudy(parseStudyInput(baseStudy())).lines[0].points[0].working).toBeUndefined(); // lazy by default (design)
    const eager = runStudy(parseStudyInput(baseStudy()), { working: 'eager' }).lines[0].points[0];
    expect(eager.working?.length).toBeGreaterThan(20); // every step from ambient to injector duty
  });
});
