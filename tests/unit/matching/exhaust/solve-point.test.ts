import { describe, expect, it } from 'vitest';
import { compressorModelFromMap, turbineModelFromMap } from '#shared/maps';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import type { OperatingLine, PointValues } from '#shared/matching/result';
import type { TurbineModel } from '#shared/matching/exhaust/model';
import { demoCompressor, demoTurbine, scaledTurbine } from '#tests/unit/maps/helpers';
import { exhaustOf, exhaustStudy } from './fixtures';
import { expectClose } from '#tests/unit/expect-close';
import { solved } from '../fixtures';

const smallTurbine = () => turbineModelFromMap(demoTurbine('ar064-single'));
const largeTurbine = () => turbineModelFromMap(demoTurbine('ar082-single'));
const valuesOf = (line: OperatingLine): PointValues[] => line.points.map(solved);
/** Points the compressor can deliver: the rest carry no results (and no exhaust side) to check. */
const reachableOf = (line: OperatingLine): PointValues[] => valuesOf(line).filter((v) => v.reachable);

function run(turbines: TurbineModel[], exhausts = turbines.map(() => exhaustOf())) {
  const study = exhaustStudy(exhausts);
  const compressor = compressorModelFromMap(demoCompressor('m58'));
  return runStudy(parseStudyInput(study), { compressorModels: turbines.map(() => compressor), turbineModels: turbines });
}

describe('the quasi-steady power balance at every point', () => {
  const result = run([smallTurbine(), largeTurbine()]);
  const all = result.lines.flatMap(reachableOf);

  it('meets all three cases of the physics note on these lines', () => {
    const cases = new Set(all.map((v) => v.exhaustCase));
    expect(cases).toContain('gate-open'); // spooled up: the gates bleed off the excess
    expect(cases).toContain('target-not-held'); // 60 kPa at 2000 rpm is more than these turbines give there
  });

  it('balances η_m·P_t = P_c where the gates are open, and at the held boost where they are shut', () => {
    let held = 0;
    for (const line of result.lines) {
      // The demo maps' efficiencies count the bearings' losses, so the Plan's 0.95 is not applied again (docs/map-format.md).
      expect(line.context.exhaust!.mechanicalEfficiency).toBe(1);
      const etaM = line.context.exhaust!.mechanicalEfficiency;
      for (const p of line.points) {
        const v = solved(p);
        if (!v.reachable) continue;
        if (v.exhaustCase === 'gate-open') expectClose(etaM * v.turbinePower!, v.compressorPower!, 1e-6, { what: `${v.rpm} rpm` }); // NASA Glenn matching; solved to 1e-6 of P_c
        if (v.exhaustCase !== 'target-not-held') continue;
        // At a compressor-map edge the compressor's state may not settle: then the point says so.
        const flagged = p.findings.some((f) => f.code === 'exhaust-not-converged');
        if (!flagged) {
          expectClose(etaM * v.turbinePower!, v.compressorPower!, 1e-4, { what: `${v.rpm} rpm held` }); // same balance, boost found to 10 Pa
          held++;
        } else expect(p.findings.some((f) => f.code === 'not-converged')).toBe(true); // only where the compressor side did not settle
      }
    }
    expect(held).toBeGreaterThan(20);
  });

  it('conserves mass: turbine plus wastegate flow is the exhaust flow, air plus fuel', () => {
    for (const v of all) {
      expectClose(v.turbineMassFlow! + v.wastegateMassFlow!, v.exhaustMassFlow!, 1e-12, { what: `${v.rpm} rpm` }); // mass balance
      expectClose(v.exhaustMassFlow!, v.engineMassFlow + v.fuelMassFlow!, 1e-12, { what: `${v.rpm} rpm` }); // one turbocharger: all the air and fuel (mass balance)
      expect(v.wastegateFraction!).toBeGreaterThanOrEqual(0);
      expect(v.wastegateFraction!).toBeLessThan(1);
    }
  });

  it('keeps p3 = ER·p4, the drive pressure ratio p3/p_man, and the gates shut where the target is not held', () => {
    for (const v of all) {
      expectClose(v.turbineInletPressure!, v.expansionRatio! * v.turbineOutletPressure!, 1e-12); // definition of ER
      expectClose(v.turbineOutletPressure!, v.ambientPressure + 15_000, 1e-12); // p4 = p_amb + downstream loss (physics note §5)
      expectClose(v.drivePressureRatio!, v.turbineInletPressure! / v.manifoldPressure, 1e-12); // definition
      if (v.exhaustCase === 'target-not-held') {
        expect(v.wastegateMassFlow).toBe(0); // case 2: gates shut (physics note §5)
        expect(v.boost).toBeLessThan(v.boostTarget!);
        expect(v.targetHeld).toBe(false);
      } else {
        expect(v.boost).toBe(v.boostTarget); // the target is held (definition)
        expect(v.expansionRatio!).toBeLessThanOrEqual(v.shutGateExpansionRatio! * (1 + 1e-12)); // case 3: the smaller ER (physics note §5)
      }
    }
  });

  it('re-solves the whole compressor side at the held boost: every value belongs to that boost', () => {
    const line = result.lines[1];
    const held = valuesOf(line).filter((v) => v.targetHeld === false);
    expect(held.length).toBeGreaterThan(3);
    for (const v of held.slice(0, 4)) {
      // The same study with the held boost as its target, compressor only: the same point.
      const study = exhaustStudy([exhaustOf()]);
      study.engine.rpm = { kind: 'list', values: [v.rpm] };
      study.scenarios[0].boostSchedule[0].boost = [{ rpm: v.rpm, value: v.boost }];
      delete study.plans[0].exhaust;
      const fresh = solved(runStudy(parseStudyInput(study), { compressorModels: [compressorModelFromMap(demoCompressor('m58'))] }).lines[0].points[0]);
      expectClose(v.manifoldPressure, v.ambientPressure + v.boost, 1e-12); // gauge boost adds to ambient (definition)
      for (const key of ['massFlow', 'manifoldTemperature', 'pressureRatio', 'compressorPower', 'fuelMassFlow', 'brakePower'] as const)
        expectClose(v[key] as number, fresh[key] as number, 1e-5, { what: key }); // the engine's own point solver at that boost (its fixed point settles to 1e-7 in η)
    }
  });

  it('gives the larger turbine a lower expansion ratio and a later boost threshold on the same engine', () => {
    const [small, large] = result.lines;
    const threshold = (l: OperatingLine) => l.exhaust!.boostThresholdRpm!;
    expect(threshold(small)).toBeGreaterThan(2000);
    expect(threshold(large)).toBeGreaterThan(threshold(small)); // more capacity, less ER for the same flow, less power at low flow
    const a = valuesOf(small);
    const b = valuesOf(large);
    for (let i = 0; i < a.length; i++) {
      if (a[i].boost !== b[i].boost) continue;
      expect(b[i].shutGateExpansionRatio!).toBeLessThan(a[i].shutGateExpansionRatio!); // swallows the same flow at a lower ratio
      if (a[i].exhaustCase === 'gate-open' && b[i].exhaustCase === 'gate-open') expect(b[i].expansionRatio!).toBeLessThan(a[i].expansionRatio!);
    }
  });

  it('gives a threshold that only a larger turbine moves later, also for a plain 30 % bigger housing', () => {
    const base = demoTurbine('ar064-single');
    const [a, b] = run([turbineModelFromMap(base), turbineModelFromMap(scaledTurbine(base, 1.3))]).lines;
    expect(b.exhaust!.boostThresholdRpm!).toBeGreaterThan(a.exhaust!.boostThresholdRpm!); // more capacity, later threshold (physics note §5)
  });

  it('summarises each line: threshold, peak drive pressure ratio, gate size, p3 at peak power', () => {
    const line = result.lines[0];
    const s = line.exhaust!;
    const vs = valuesOf(line);
    // The first rpm that holds target where the compressor can deliver it (definition), and the first the turbine holds it at all.
    expect(s.boostThresholdRpm).toBe(vs.find((v) => v.targetHeld && v.reachable)!.rpm);
    expect(s.turbineHoldsFromRpm).toBe(vs.find((v) => v.targetHeld)!.rpm);
    // Over the points at their target boost only: below the threshold p3/p_man of a barely boosted manifold says little.
    expect(s.peakDrivePressureRatio!.value).toBe(
      Math.max(...vs.filter((v) => v.targetHeld && v.drivePressureRatio !== null).map((v) => v.drivePressureRatio!)),
    );
    expect(s.wastegateDiameterNeeded!.value).toBe(Math.max(...vs.map((v) => v.wastegateDiameterNeeded ?? 0)));
    expect(s.wastegateDiameterFitted).toBe(0.04);
    const peak = vs.reduce((m, v) => (v.brakePower! > m.brakePower! ? v : m));
    expect(s.turbineInletPressureAtPeakPower).toEqual({ value: peak.turbineInletPressure, rpm: peak.rpm });
  });
});

describe('a divided housing with per-scroll maps and two gates', () => {
  it('reproduces the single-scroll result when its scrolls together have the same capacity and the pulse factor is 1.0', () => {
    const singleMap = demoTurbine('ar082-single');
    const perScroll = scaledTurbine(singleMap, 0.5, { housing: 'divided', scrollFeed: 'per-scroll' });
    const oneGate = exhaustOf({ wastegates: { count: 1, valveDiameter: 0.04, dischargeCoefficient: 0.8 } });
    // Two gates of half the area each: the same total valve area.
    const twoGates = exhaustOf({ housing: 'divided', pulseFactor: 1, wastegates: { count: 2, valveDiameter: 0.04 / Math.SQRT2, dischargeCoefficient: 0.8 } });
    const [single, divided] = run([turbineModelFromMap(singleMap), turbineModelFromMap(perScroll)], [oneGate, twoGates]).lines;
    expect(divided.exhaust!.boostThresholdRpm).toBe(single.exhaust!.boostThresholdRpm);
    const a = valuesOf(single);
    const b = valuesOf(divided);
    for (let i = 0; i < a.length; i++) {
      expect(b[i].reachable).toBe(a[i].reachable);
      if (!a[i].reachable) continue;
      for (const key of [
        'boost',
        'expansionRatio',
        'turbineInletPressure',
        'drivePressureRatio',
        'turbinePower',
        'turbineMassFlow',
        'wastegateFraction',
        'compressorPower',
      ] as const)
        expectClose(b[i][key] as number, a[i][key] as number, 1e-9, { what: `${key} at ${a[i].rpm} rpm` }); // two scrolls in parallel at one p3 are one turbine of twice the scroll's capacity (physics note §5)
      expectClose(b[i].turbineMapFlowParameter!, a[i].turbineFlowParameter! / 2, 1e-9); // placed on the per-scroll map at half the flow (definition)
      if (a[i].wastegateDiameterNeeded) expectClose(b[i].wastegateDiameterNeeded!, a[i].wastegateDiameterNeeded! / Math.SQRT2, 1e-9); // each gate passes half (orifice relation)
    }
  });

  it('gives more turbine energy with a pulse factor above 1, so an earlier threshold', () => {
    const perScroll = turbineModelFromMap(demoTurbine('ar082-divided'));
    const divided = (pulseFactor: number) =>
      exhaustOf({ housing: 'divided', pulseFactor, wastegates: { count: 2, valveDiameter: 0.032, dischargeCoefficient: 0.8 } });
    const [plain, pulsed] = run([perScroll, perScroll], [divided(1), divided(1.15)]).lines;
    expect(pulsed.exhaust!.boostThresholdRpm!).toBeLessThan(plain.exhaust!.boostThresholdRpm!); // a factor on turbine energy (physics note §5)
    expect(pulsed.points[0].findings.some((f) => f.code === 'input-out-of-range' && /pulse-energy factor/.test(f.message))).toBe(true); // named assumption shown
  });
});

describe('compressor-only plans', () => {
  it('are computed exactly as before: no exhaust values, the target as the boost', () => {
    const study = exhaustStudy([exhaustOf()]);
    delete study.plans[0].exhaust;
    const line = runStudy(parseStudyInput(study)).lines[0];
    expect(line.exhaust).toBeNull();
    expect(line.context.exhaust).toBeNull();
    for (const v of valuesOf(line)) {
      expect(v.boostTarget).toBe(v.boost); // no turbine: the target stands (definition)
      for (const key of ['targetHeld', 'exhaustCase', 'turbineInletPressure', 'expansionRatio', 'wastegateDiameterNeeded', 'turbinePower'] as const)
        expect(v[key]).toBeNull();
    }
  });
});
