import { describe, expect, it } from 'vitest';
import { MAX_ITERATIONS } from '#shared/matching/compressor/solve-point';
import { pointWorking } from '#shared/matching/explain-point';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import type { CompressorModel, MapLocation } from '#shared/matching/compressor/model';
import { AIR_GAS_CONSTANT, compressorOutletTemperature } from '#shared/physics';
import { expectClose } from '#tests/unit/expect-close';
import { baseStudy, fakeModel, solved, withBoost } from '../fixtures';

describe('a compressor model supplied with the plan', () => {
  it('takes the efficiency from the map and iterates the manifold temperature to its fixed point', () => {
    const model = fakeModel();
    const line = runStudy(parseStudyInput(baseStudy()), { compressorModels: [model] }).lines[0];
    const v = solved(line.points[3]); // 5000 rpm, 120 kPa boost: inside the fake map
    expect(v.efficiencySource).toBe('map'); // design: the map gives efficiency
    expect(v.converged).toBe(true); // a plane settles in a few passes
    expect(v.iterations).toBeGreaterThan(1); // efficiency depends on flow, so it takes more than one pass
    // At the fixed point the efficiency read at the final corrected flow is the one used (plane a + b·ṁc + c·PR)
    expectClose(model.read(v.correctedMassFlow, v.pressureRatio).efficiency!, v.compressorEfficiency!, 1e-6);
    // …and the manifold temperature follows from T2 at that efficiency (ε = 0.7, coolant = ambient), Incropera & DeWitt §11.4
    const t2 = compressorOutletTemperature(v.compressorInletTemperature, v.pressureRatio, v.compressorEfficiency!);
    expectClose(v.compressorOutletTemperature!, t2, 1e-12);
    expectClose(v.manifoldTemperature, t2 - 0.7 * (t2 - 298.15), 1e-12);
    expectClose(v.airDensity, v.manifoldPressure / (AIR_GAS_CONSTANT * v.manifoldTemperature), 1e-12); // ideal gas
    const working = pointWorking(line.context, line.points[3]);
    expect(working.find((s) => s.id === 'manifold-temperature')?.explanation).toMatch(new RegExp(`${v.iterations} passes`)); // the Working shows the count
  });

  it('uses the map reference for corrected flow, never a fixed one', () => {
    const study = baseStudy();
    study.intercooler = { kind: 'fixed', manifoldTemperature: 320 };
    const a = fakeModel({ reference: { temperature: 298.15, pressure: 100_000 } });
    const b = fakeModel({ reference: { temperature: 288.15, pressure: 101_325 } });
    const va = solved(runStudy(parseStudyInput(study), { compressorModels: [a] }).lines[0].points[2]);
    const vb = solved(runStudy(parseStudyInput(study), { compressorModels: [b] }).lines[0].points[2]);
    expectClose(va.massFlow, vb.massFlow, 1e-12); // same engine, same manifold state
    expectClose(va.correctedMassFlow / vb.correctedMassFlow, Math.sqrt(288.15 / 298.15) * (100_000 / 101_325), 1e-12); // definition of corrected flow
  });

  it("turns the speed lines' corrected speed into the wheel's real speed, N = N_c·√(T1/T_ref)", () => {
    const study = baseStudy();
    study.intercooler = { kind: 'fixed', manifoldTemperature: 320 };
    const model = fakeModel({ reference: { temperature: 298.15, pressure: 100_000 } });
    const line = runStudy(parseStudyInput(study), { compressorModels: [model] }).lines[0];
    const v = solved(line.points[3]);
    const read = model.read(v.correctedMassFlow, v.pressureRatio).shaftSpeed!;
    expect(v.correctedShaftSpeed).toBe(read);
    // Corrected speed N_c = N/√(θ), θ = T1/T_ref (NASA Glenn "corrected speed"; the same correction as corrected flow).
    expectClose(v.shaftSpeed!, read * Math.sqrt(v.compressorInletTemperature / 298.15), 1e-12);
    // A hotter day: same corrected point would mean a faster wheel.
    const hot = baseStudy();
    hot.intercooler = { kind: 'fixed', manifoldTemperature: 320 };
    hot.scenarios[0].ambient = { pressure: 101_325, temperature: 318.15 };
    const vh = solved(runStudy(parseStudyInput(hot), { compressorModels: [model] }).lines[0].points[3]);
    expect(vh.shaftSpeed! / vh.correctedShaftSpeed!).toBeGreaterThan(v.shaftSpeed! / v.correctedShaftSpeed!);
    const step = pointWorking(line.context, line.points[3]).find((s) => s.id === 'shaft-speed')!;
    expect(step.formula).toBe('N_c * sqrt(T_1 / T_ref)');
    expectClose(step.result.value, v.shaftSpeed!, 1e-12);
  });

  it('does not deliver a point outside the speed lines: placed with the plan efficiency, no results', () => {
    const model = fakeModel({ forceLocation: 'off-map' });
    const line = runStudy(parseStudyInput(baseStudy()), { compressorModels: [model] }).lines[0];
    const p = line.points[3];
    const v = solved(p);
    expect(v.mapRegion).toBe('outside-speed-lines');
    expect(v.reachable).toBe(false); // the map cannot say the compressor runs there (design: "not reachable")
    expect(v.placementEfficiency).toBe(0.72); // the plan's (baseStudy), used only to place the point
    for (const key of [
      'compressorEfficiency',
      'compressorOutletTemperature',
      'compressorPower',
      'brakePower',
      'torque',
      'fuelMassFlow',
      'injectorDuty',
    ] as const)
      expect(v[key], key).toBeNull();
    expect(v.correctedMassFlow).toBeGreaterThan(0); // where it lies is still known
    expect(p.findings.map((f) => [f.code, f.severity])).toEqual(expect.arrayContaining([['map-off-map', 'limit']]));
    expect(p.findings.find((f) => f.code === 'map-off-map')?.message).toMatch(/Not reachable with this compressor/);
  });

  it('computes such a point on an explicit off-map efficiency, and names the assumption', () => {
    const study = baseStudy();
    study.plans[0].offMapEfficiency = 0.6;
    const p = runStudy(parseStudyInput(study), { compressorModels: [fakeModel({ forceLocation: 'beyond-choke' })] }).lines[0].points[3];
    const v = solved(p);
    expect(v.reachable).toBe(true); // the assumption covers a point past choke (design)
    expect(v.efficiencySource).toBe('off-map-assumption');
    expect(v.compressorEfficiency).toBe(0.6); // the assumption, as given
    expect(v.brakePower).toBeGreaterThan(0);
    expect(p.findings.find((f) => f.code === 'off-map-assumption')?.severity).toBe('warning');
    expect(p.findings.find((f) => f.code === 'map-beyond-choke')?.severity).toBe('limit'); // still past choke: the verdict still says so
  });

  it('never assumes surge or overspeed away', () => {
    const study = baseStudy();
    study.plans[0].offMapEfficiency = 0.6;
    const v = solved(runStudy(parseStudyInput(study), { compressorModels: [fakeModel({ forceLocation: 'left-of-surge' })] }).lines[0].points[3]);
    expect(v.reachable).toBe(false); // surge is a hard limit, not a gap in the map (design)
    expect(v.brakePower).toBeNull();
  });

  const cases: [MapLocation, string, string][] = [
    ['left-of-surge', 'map-left-of-surge', 'limit'],
    ['beyond-choke', 'map-beyond-choke', 'limit'],
    ['above-top-speed', 'map-above-top-speed', 'limit'],
    ['below-map', 'map-below-map', 'info'],
    ['off-map', 'map-off-map', 'limit'],
  ];
  for (const [location, code, severity] of cases) {
    it(`turns "${location}" into finding ${code} (${severity})`, () => {
      const p = runStudy(parseStudyInput(baseStudy()), { compressorModels: [fakeModel({ forceLocation: location })] }).lines[0].points[0];
      expect(p.findings.find((f) => f.code === code)?.severity).toBe(severity); // severities: design (a point the compressor cannot deliver is at a limit)
    });
  }

  it('finds a real surge point from the flow and the surge line', () => {
    const model = fakeModel({ surgeSlope: 0.3 }); // steep surge line: low-rpm points fall left of it
    const p = runStudy(parseStudyInput(baseStudy()), { compressorModels: [model] }).lines[0].points[0];
    const v = solved(p);
    expect(v.mapLocation).toBe('left-of-surge'); // ṁc < 0.3·(PR − 1) at 2000 rpm and 40 kPa
    expectClose(v.surgeMargin!, (v.correctedMassFlow - 0.3 * (v.pressureRatio - 1)) / v.correctedMassFlow, 1e-12); // margin definition, physics note §3
    expect(v.surgeMargin!).toBeLessThan(0); // left of surge means negative margin (definition)
  });

  it('calls over speed a limit against the lower of the plan and map limits', () => {
    const model = fakeModel({ maxSpeed: 200_000 });
    const study = baseStudy();
    const v = solved(runStudy(parseStudyInput(study), { compressorModels: [model] }).lines[0].points[3]);
    expect(v.maxShaftSpeed).toBe(200_000); // the map's
    expect(v.shaftSpeed!).toBeLessThan(200_000);
    study.plans[0].maxShaftSpeed = v.shaftSpeed! - 1000; // the plan is stricter
    const p = runStudy(parseStudyInput(study), { compressorModels: [model] }).lines[0].points[3];
    expect(solved(p).maxShaftSpeed).toBe(v.shaftSpeed! - 1000); // lower of the two (design)
    expectClose(solved(p).speedMargin!, -1000 / (v.shaftSpeed! - 1000), 1e-9); // (Nmax − N)/Nmax, physics note §3
    expect(p.findings.find((f) => f.code === 'overspeed')?.severity).toBe('limit'); // design
  });

  it('shows shaft speed and each margin as a Working step', () => {
    const line = runStudy(parseStudyInput(baseStudy()), { compressorModels: [fakeModel()] }).lines[0];
    const ids = pointWorking(line.context, line.points[3]).map((s) => s.id);
    expect(ids).toEqual(expect.arrayContaining(['shaft-speed', 'surge-margin', 'choke-margin', 'speed-margin', 'compressor-efficiency'])); // design
  });

  it('stops after a bounded number of passes with a finding when the map makes the fixed point jump', () => {
    const study = withBoost(baseStudy(), 120_000);
    study.engine.rpm = { kind: 'list', values: [5000] };
    const constant = (efficiency: number): CompressorModel => ({
      reference: { temperature: 298.15, pressure: 100_000 },
      maxSpeed: null,
      read: () => ({ efficiency, shaftSpeed: null, surgeMargin: null, chokeMargin: null, speedMargin: null, location: 'inside' }),
    });
    const flowAt = (efficiency: number) =>
      solved(runStudy(parseStudyInput(study), { compressorModels: [constant(efficiency)] }).lines[0].points[0]).correctedMassFlow;
    // Cooler charge (η 0.8) means more flow; if more flow then reads η 0.5 and less flow reads 0.8, there is no fixed point.
    const threshold = (flowAt(0.5) + flowAt(0.8)) / 2;
    const jumpy: CompressorModel = { ...constant(0), read: (mc) => ({ ...constant(0).read(mc, 1), efficiency: mc < threshold ? 0.8 : 0.5 }) };
    const p = runStudy(parseStudyInput(study), { compressorModels: [jumpy] }).lines[0].points[0];
    expect(solved(p).converged).toBe(false); // no fixed point exists (constructed)
    expect(solved(p).iterations).toBe(MAX_ITERATIONS); // bounded (design)
    expect(p.findings.find((f) => f.code === 'not-converged')?.severity).toBe('warning'); // design
    expect(Number.isFinite(solved(p).manifoldTemperature)).toBe(true); // never NaN
  });

  it('never lets a faulty map leak NaN or Infinity', () => {
    const faulty: CompressorModel = {
      reference: { temperature: 298.15, pressure: 100_000 },
      maxSpeed: Number.NaN,
      read: () => ({
        efficiency: Number.NaN,
        shaftSpeed: Infinity,
        surgeMargin: Number.NaN,
        chokeMargin: -Infinity,
        speedMargin: Number.NaN,
        location: 'nowhere' as MapLocation,
      }),
    };
    const p = runStudy(parseStudyInput(baseStudy()), { compressorModels: [faulty] }).lines[0].points[2];
    const v = solved(p);
    expect(v.efficiencySource).toBe('plan'); // NaN efficiency is treated as off the map
    expect([v.shaftSpeed, v.surgeMargin, v.chokeMargin, v.speedMargin, v.maxShaftSpeed]).toEqual([null, null, null, null, null]);
    expect(v.mapLocation).toBe('off-map'); // an unknown location is off the map
  });
});
