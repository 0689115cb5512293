import { describe, expect, it } from 'vitest';
import { compressorModelFromMap, turbineModelFromMap } from '#shared/maps';
import { DRIVE_PRESSURE_RATIO_WARNING } from '#shared/matching/exhaust/findings';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import type { OperatingLine } from '#shared/matching/result';
import type { TurbineModel } from '#shared/matching/exhaust/model';
import { demoCompressor, demoTurbine, scaledTurbine } from '#tests/unit/maps/helpers';
import { exhaustOf, exhaustStudy } from './fixtures';
import { solved } from '../fixtures';

const compressor = () => compressorModelFromMap(demoCompressor('m58'));
const lineWith = (turbine: TurbineModel | null, exhaust = exhaustOf(), change?: (s: ReturnType<typeof exhaustStudy>) => void): OperatingLine => {
  const study = exhaustStudy([exhaust]);
  change?.(study);
  return runStudy(parseStudyInput(study), { compressorModels: [compressor()], turbineModels: [turbine] }).lines[0];
};
const codesAt = (line: OperatingLine) => line.points.map((p) => p.findings.map((f) => `${f.code}:${f.severity}`));
const all = (line: OperatingLine) => line.points.flatMap((p) => p.findings);

describe('exhaust findings', () => {
  it('says the target is not held: info below the boost threshold, a warning when it is lost after it', () => {
    // An invented exhaust that cools sharply from 6000 rpm: the turbine loses the energy to hold the target.
    const cooling = exhaustOf({
      turbineInletTemperature: [
        { rpm: 2000, value: 1000 },
        { rpm: 6000, value: 1170 },
        { rpm: 6500, value: 450 },
      ],
    });
    const line = lineWith(turbineModelFromMap(demoTurbine('ar064-single')), cooling);
    // Spool-up is judged from the first speed the turbine holds the target (the threshold proper also needs the compressor to deliver it).
    const threshold = line.exhaust!.turbineHoldsFromRpm!;
    expect(line.exhaust!.boostThresholdRpm!).toBeGreaterThanOrEqual(threshold);
    for (const p of line.points) {
      const f = p.findings.find((x) => x.code === 'boost-target-not-held');
      if (p.rpm < threshold) expect(f?.severity).toBe('info'); // spool-up below the threshold (design)
      if (p.rpm >= 6500) expect(f?.severity).toBe('warning'); // lost after the threshold (design)
    }
  });

  it('warns once when the target is held nowhere on the line', () => {
    const tiny = turbineModelFromMap(scaledTurbine(demoTurbine('ar082-single'), 4));
    const line = lineWith(tiny);
    expect(line.exhaust!.boostThresholdRpm).toBeNull();
    expect(all(line).filter((f) => /no engine speed/.test(f.message))).toHaveLength(1);
  });

  it('finds a wastegate too small for the flow the turbine does not need', () => {
    const line = lineWith(
      turbineModelFromMap(demoTurbine('ar064-single')),
      exhaustOf({ wastegates: { count: 1, valveDiameter: 0.01, dischargeCoefficient: 0.8 } }),
    );
    const small = all(line).filter((f) => f.code === 'wastegate-too-small');
    expect(small.length).toBeGreaterThan(0);
    for (const f of small) {
      expect(f.value!).toBeGreaterThan(f.threshold!); // needed over fitted (definition)
      expect(f.threshold).toBe(0.01);
      expect(f.kind).toBe('length');
    }
    const margins = line.points.map((p) => p.values!.wastegateMargin).filter((m): m is number => m !== null && m !== undefined);
    expect(margins.some((m) => m < 0)).toBe(true); // negative margin where too small (definition)
  });

  it('warns of a drive pressure ratio above 2 with a small turbine, and of running beyond the turbine map', () => {
    const small = turbineModelFromMap(scaledTurbine(demoTurbine('ar064-single'), 0.2));
    const line = lineWith(small);
    const high = all(line).filter((f) => f.code === 'drive-pressure-ratio-high');
    expect(high.length).toBeGreaterThan(0);
    for (const f of high) expect(f.value!).toBeGreaterThan(DRIVE_PRESSURE_RATIO_WARNING); // 2.0: common practice, no source
    expect(DRIVE_PRESSURE_RATIO_WARNING).toBe(2); // common practice, no source
    expect(all(line).some((f) => f.code === 'turbine-off-map' && f.severity === 'warning')).toBe(true); // beyond the map's highest ER (design)
  });

  it('notes points below the turbine map as info', () => {
    const line = lineWith(turbineModelFromMap(demoTurbine('ar082-single')));
    expect(codesAt(line)[0]).toContain('turbine-off-map:info'); // 2000 rpm: ER below the map's 1.35 (hand-read from the file)
  });

  it('says when the exhaust side cannot be computed: no turbine map', () => {
    const line = lineWith(null);
    expect(line.points[0].findings.map((f) => f.code)).toContain('turbine-map-missing');
    expect(line.exhaust).toBeNull();
    expect(solved(line.points[3]).exhaustCase).toBeNull();
  });

  it('says when the Plan’s housing and the map’s differ', () => {
    const line = lineWith(turbineModelFromMap(demoTurbine('ar082-divided')), exhaustOf({ housing: 'single' }));
    expect(line.points[0].findings.map((f) => f.code)).toContain('turbine-housing-mismatch');
    expect(
      line.points
        .slice(1)
        .flatMap((p) => p.findings)
        .map((f) => f.code),
    ).not.toContain('turbine-housing-mismatch'); // once per line (design)
  });

  it('uses the assumed turbine efficiency where the map gives none, and says so', () => {
    const map = demoTurbine('ar082-single');
    const bare = { ...map, curves: map.curves.map((c) => ({ ...c, points: c.points.map((p) => ({ ...p, efficiency: null })) })) };
    const line = lineWith(turbineModelFromMap(bare), exhaustOf({ turbineEfficiency: 0.6 }));
    expect(solved(line.points[30]).turbineEfficiency).toBe(0.6); // the Plan's assumption (definition)
    expect(all(line).some((f) => f.code === 'turbine-efficiency-assumed')).toBe(true);
  });

  it('takes the gates wide open at part throttle, where the compressor needs no power', () => {
    const line = lineWith(turbineModelFromMap(demoTurbine('ar082-single')), exhaustOf(), (s) => {
      s.scenarios[0].boostSchedule[0] = { label: 'Part', kind: 'part-throttle', boost: [{ rpm: 2000, value: -40_000 }] };
    });
    for (const p of line.points) {
      const v = solved(p);
      expect(v.exhaustCase).toBe('no-power-needed');
      expect(v.compressorPower).toBe(0); // throttled: PR 1 (docs/physics.md §2)
      expect(v.wastegateDiameterNeeded).toBeNull(); // the throttle, not the gates, sets boost (design)
      expect(Math.abs(v.turbineMassFlow! + v.wastegateMassFlow! - v.exhaustMassFlow!)).toBeLessThanOrEqual(1e-12 * v.exhaustMassFlow!); // mass balance
    }
  });

  it('reports a root not found as a finding and leaves no NaN: a turbine that passes nothing', () => {
    const blocked: TurbineModel = {
      ...turbineModelFromMap(demoTurbine('ar082-single')),
      expansionRatioForFlow: undefined,
      read: () => ({ flowParameter: 0, efficiency: 0.7, location: 'inside' }),
    };
    const line = lineWith(blocked);
    expect(all(line).some((f) => f.code === 'exhaust-not-converged')).toBe(true);
    for (const p of line.points) for (const value of Object.values(p.values ?? {})) if (typeof value === 'number') expect(Number.isFinite(value)).toBe(true);
  });

  it('leaves the exhaust side out, with a finding, for exhaust inputs no schema would pass', () => {
    const study = exhaustStudy([exhaustOf({ mechanicalEfficiency: -1 })]);
    const line = runStudy(study, { turbineModels: [turbineModelFromMap(demoTurbine('ar082-single'))] }).lines[0];
    expect(line.points[0].findings.some((f) => /not computed/.test(f.message))).toBe(true);
    expect(solved(line.points[5]).expansionRatio).toBeNull();
  });
});
