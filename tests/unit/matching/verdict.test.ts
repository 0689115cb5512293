import { describe, expect, it } from 'vitest';
import { computeRequestSchema } from '#shared/schemas/compute';
import {
  planVerdicts,
  reasonText,
  REQUIREMENT_DEFAULTS,
  resolveRequirements,
  runComputeRequest,
  runStudy,
  verdictOf,
  type OperatingPoint,
  type PointValues,
} from '#shared/matching';
import { expectClose } from '../physics/expect-close';
import { baseStudy, fakeModel } from './fixtures';

const solved = (p: OperatingPoint): PointValues => {
  if (!p.solved) throw new Error('not solved');
  return p.values;
};

/** One point through the compute contract: 2.0 L four-stroke, 6000 rpm, VE 0.90, 200 kPa abs, 320 K, petrol. */
function computeAt(lambda: number, boost = 98_675) {
  const req = computeRequestSchema.parse({
    engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
    ambient: { pressure: 101_325, temperature: 293.15 },
    fuel: { kind: 'petrol', lambda, brakeThermalEfficiency: 0.3 },
    points: [{ rpm: 6000, volumetricEfficiency: 0.9, boost, manifoldTemperature: 320 }],
  });
  return runComputeRequest(req).points[0];
}

describe('brake power from whichever of air and fuel runs out first', () => {
  // ṁ_air = VE·ρ_man·V_d·N/(60·n_R) with ρ_man = 200000/(287.05287·320) = 2.17727 kg/m³:
  // 0.9·2.17727·0.002·6000/120 = 0.195955 kg/s (Heywood 1988, §2.10; worked by hand).
  const air = 0.9 * (200_000 / (287.05287 * 320)) * 0.002 * (6000 / 120);

  it('rich or stoichiometric: the air sets it, P = η_b·LHV·ṁ_air/AFR_s', () => {
    // Heywood 1988, eq. 2.23 (η_f = P/(ṁ_f·Q_LHV)) with only the fuel that finds air burning; petrol
    // AFR_s 14.7 and LHV 44 MJ/kg (Heywood App. D). 0.3·44e6·0.195955/14.7 = 175 960 W (worked by hand).
    expectClose(computeAt(0.8).brakePower!, (0.3 * 44e6 * air) / 14.7, 1e-9);
    expectClose(computeAt(1.0).brakePower!, (0.3 * 44e6 * air) / 14.7, 1e-9);
  });

  it('lean: only the fuel supplied burns, P = η_b·LHV·ṁ_fuel, so power falls as 1/λ', () => {
    // ṁ_fuel = ṁ_air/(λ·AFR_s) (definition of λ); same eq. 2.23. λ 1.2: 146 633 W; λ 2.0: 87 980 W (worked by hand).
    expectClose(computeAt(1.2).brakePower!, (0.3 * 44e6 * air) / (1.2 * 14.7), 1e-9);
    expectClose(computeAt(2.0).brakePower!, (0.3 * 44e6 * air) / (2.0 * 14.7), 1e-9);
    expect(computeAt(1.2).brakePower!).toBeLessThan(computeAt(0.8).brakePower!);
  });

  it('says in the Working which of the two sets the power', () => {
    const study = baseStudy();
    study.fuelSystem.lambda = [{ rpm: 2000, value: 1.1 }];
    const v = solved(runStudy(study).lines[0].points[2]);
    expect(v.powerLimitedBy).toBe('fuel');
    study.fuelSystem.lambda = [{ rpm: 2000, value: 0.85 }];
    expect(solved(runStudy(study).lines[0].points[2]).powerLimitedBy).toBe('air');
  });
});

describe('lean mixtures under boost', () => {
  it('lambda 1.05 at 160 kPa of boost on petrol is at a limit', () => {
    const f = computeAt(1.05, 160_000).findings.find((x) => x.code === 'lean-under-boost-limit');
    expect(f?.severity).toBe('limit'); // above the 1.0 limit under boost (common practice, no source)
    expect(f?.message).toMatch(/1\.05/);
  });

  it('lambda 0.95 under boost is a warning, and no boost raises nothing', () => {
    expect(computeAt(0.95, 160_000).findings.find((x) => x.code === 'lean-under-boost')?.severity).toBe('warning'); // above the 0.9 default (common practice, no source)
    expect(computeAt(1.05, 0).findings.some((x) => x.code.startsWith('lean-under-boost'))).toBe(false); // 0 Pa gauge is not under boost
  });
});

describe('required margins', () => {
  it('fills absent requirements with the defaults, and keeps what the study gives', () => {
    expect(resolveRequirements(undefined)).toEqual(REQUIREMENT_DEFAULTS);
    expect(resolveRequirements({ minSurgeMargin: 0.1 })).toEqual({ ...REQUIREMENT_DEFAULTS, minSurgeMargin: 0.1 });
  });

  it('turns a margin thinner than required into a warning with the figure and the rpm', () => {
    const study = baseStudy();
    const quiet = runStudy(study, { compressorModels: [fakeModel({ surgeSlope: 0.01 })] }).lines[0];
    expect(quiet.points.flatMap((p) => p.findings).some((f) => f.code === 'surge-margin-thin')).toBe(false);
    study.requirements = { minSurgeMargin: 0.5 };
    const line = runStudy(study, { compressorModels: [fakeModel({ surgeSlope: 0.1 })] }).lines[0];
    const p = line.points[3];
    expect(solved(p).surgeMargin!).toBeGreaterThan(0);
    expect(solved(p).surgeMargin!).toBeLessThan(0.5); // (ṁc − 0.1·(PR − 1))/ṁc of the fake map at 5000 rpm
    const f = p.findings.find((x) => x.code === 'surge-margin-thin')!;
    expect(f.severity).toBe('warning');
    expect(f.value).toBe(solved(p).surgeMargin); // the point's own margin
    expect(f.threshold).toBe(0.5); // the study's requirement
    expect(f.rpm).toBe(5000);
    expect(f.message).toMatch(/under the 50 % the study requires/);
  });
});

describe('the verdict of a plan', () => {
  it('fits when every point is on the map with the required margins', () => {
    const result = runStudy(baseStudy(), { compressorModels: [fakeModel({ surgeSlope: 0.01 })] });
    const [v] = planVerdicts(result);
    expect(v.status).toBe('fits');
    expect(v.reasons).toEqual([]);
    expect(v.headline).toMatch(/^Fits:/);
  });

  it('fits with warnings when a margin is thinner than required, naming it and where', () => {
    const study = baseStudy();
    study.requirements = { minSurgeMargin: 0.5 };
    const [v] = planVerdicts(runStudy(study, { compressorModels: [fakeModel({ surgeSlope: 0.06 })] })); // margins 0.3–0.7 on the fake map
    expect(v.status).toBe('fits-with-warnings');
    expect(v.reasons[0].code).toBe('surge-margin-thin');
    expect(v.headline).toMatch(/^Fits with warnings: surge margin thinner than required (from|at) [0-9,–]+ rpm at “Sea level”/);
  });

  it('does not fit when a point crosses a limit, and counts points, not findings', () => {
    const result = runStudy(baseStudy(), { compressorModels: [fakeModel({ surgeSlope: 0.3 })] }); // steep surge line: the low speeds surge
    const [v] = planVerdicts(result);
    expect(v.status).toBe('does-not-fit');
    expect(v.reasons[0].code).toBe('map-left-of-surge');
    const limitPoints = result.lines[0].points.filter((p) => p.findings.some((f) => f.severity === 'limit')).length;
    expect(v.pointsAtLimit).toBe(limitPoints); // one count per point (definition)
    expect(reasonText(v.reasons[0])).toMatch(/^left of surge (at|from) 2,000/);
  });

  it('is not judged without a compressor map', () => {
    const [v] = planVerdicts(runStudy(baseStudy()));
    expect(v.status).toBe('not-judged');
    expect(v.headline).toMatch(/no compressor map/);
  });

  it('orders reasons: limits first, then the trouble that covers the most points', () => {
    const study = baseStudy();
    study.requirements = { minSurgeMargin: 0.5 };
    // Surge line 0.1·(PR − 1): the two lowest speeds surge, the rest sit right of it by less than 50 %.
    const result = runStudy(study, { compressorModels: [fakeModel({ surgeSlope: 0.1 })] });
    const v = verdictOf(result.lines);
    expect(v.reasons[0].severity).toBe('limit');
    expect(v.reasons[0].code).toBe('map-left-of-surge');
    expect(v.reasons[1].code).toBe('surge-margin-thin');
    const severities = v.reasons.map((r) => r.severity);
    expect(severities.indexOf('warning')).toBeGreaterThan(severities.lastIndexOf('limit'));
  });
});

describe('the required margins block', () => {
  it('refuses a lambda warning above the limit that will apply, the default one included', async () => {
    const { requirementsSchema } = await import('#shared/schemas/compute');
    // The default limit is 1.0 (common practice, no source): a warning at 1.05 would never be reached.
    const alone = requirementsSchema.safeParse({ lambdaWarningUnderBoost: 1.05 });
    expect(alone.success).toBe(false);
    expect(alone.error?.issues[0].path).toEqual(['lambdaWarningUnderBoost']);
    const both = requirementsSchema.safeParse({ lambdaWarningUnderBoost: 1.05, lambdaLimitUnderBoost: 1.1 });
    expect(both.success).toBe(true);
    const limitOnly = requirementsSchema.safeParse({ lambdaLimitUnderBoost: 0.85 }); // below the 0.9 default warning
    expect(limitOnly.success).toBe(false);
    expect(limitOnly.error?.issues[0].path).toEqual(['lambdaLimitUnderBoost']);
  });
});
