import fc from 'fast-check';
import psychrolib from 'psychrolib';
import { describe, expect, it } from 'vitest';
import { compressorModelFromMap, turbineModelFromMap } from '#shared/maps';
import type { TurbineCurve, TurbineMap } from '#shared/maps/types';
import { runComputeRequest } from '#shared/compute/run';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import type { OperatingLine, PointValues } from '#shared/matching/result';
import type { StudyInput } from '#shared/matching/input/study';
import { AIR_GAS_CONSTANT, exhaustGasAt, humidAirGas, humidityRatioFromRelativeHumidity } from '#shared/physics';
import { computeRequestSchema } from '#shared/schemas/compute';
import { migrateStudyDocument, STUDY_SCHEMA_VERSION, studyDocumentSchema } from '#shared/schemas/study';
import { demoCompressor, demoTurbine } from '../maps/helpers';
import { exhaustOf, exhaustStudy } from './exhaust/fixtures';
import { expectClose } from '../expect-close';
import { baseStudy, CC_PER_MIN, solved } from './fixtures';

const R = AIR_GAS_CONSTANT;
const valuesOf = (line: OperatingLine): PointValues[] => line.points.map(solved);

/** One point of the base study at 6000 rpm and 150 kPa of boost, with the manifold at a stated 320 K. */
function onePoint(change: (s: StudyInput) => void = () => {}): StudyInput {
  const study = baseStudy();
  study.engine.rpm = { kind: 'list', values: [6000] };
  study.engine.volumetricEfficiency = [{ rpm: 6000, value: 0.95 }];
  study.intercooler = { kind: 'fixed', manifoldTemperature: 320 };
  study.scenarios[0].boostSchedule[0].boost = [{ rpm: 6000, value: 150_000 }];
  study.fuelSystem.lambda = [{ rpm: 6000, value: 0.85 }];
  change(study);
  return study;
}

describe('losses that follow the flow', () => {
  it('scale as ṁ²/ρ at the point, worked by hand with the manifold temperature stated', () => {
    const study = onePoint((s) => {
      s.losses = {
        inlet: { pressureLoss: 2500, referenceMassFlow: 0.2, referenceDensity: 1.2 },
        chargeCooler: { pressureLoss: 12_000, referenceMassFlow: 0.2, referenceDensity: 2.4 },
      };
    });
    const v = solved(runStudy(parseStudyInput(study)).lines[0].points[0]);
    // By hand (definitions, Heywood 1988 §2.10 for the flow): p_man = 101 325 + 150 000 Pa; ρ_man = p_man/(R·320 K);
    // ṁ = 0.95·ρ_man·0.002·6000/120; ρ_in = 101 325/(R·298.15 K) (ambient pressure, inlet temperature).
    const pMan = 251_325;
    const rhoMan = pMan / (R * 320);
    const flow = (0.95 * rhoMan * 0.002 * 6000) / 120;
    const rhoIn = 101_325 / (R * 298.15);
    const dpIn = 2500 * (flow / 0.2) ** 2 * (1.2 / rhoIn);
    const dpCc = 12_000 * (flow / 0.2) ** 2 * (2.4 / rhoMan);
    expectClose(v.engineMassFlow, flow, 1e-12);
    expectClose(v.inletLoss!, dpIn, 1e-12);
    expectClose(v.chargeCoolerLoss!, dpCc, 1e-12);
    expectClose(v.compressorInletPressure, 101_325 - dpIn, 1e-12);
    expectClose(v.pressureRatio, (pMan + dpCc) / (101_325 - dpIn), 1e-12);
  });

  it('settle with the manifold temperature where an intercooler sets it, and lose less at low flow than the fixed form', () => {
    const scaled = baseStudy();
    scaled.losses = {
      inlet: { pressureLoss: 2000, referenceMassFlow: 0.25 },
      chargeCooler: { pressureLoss: 8000, referenceMassFlow: 0.25, referenceDensity: 2.4 },
    };
    const fixed = runStudy(parseStudyInput(baseStudy())).lines[0].points.map(solved);
    const moving = runStudy(parseStudyInput(scaled)).lines[0].points.map(solved);
    for (const v of moving) {
      expect(v.converged).toBe(true);
      // The settled point's losses are those of its own flow and density (Δp = Δp_ref·(ṁ/ṁ_ref)²·ρ_ref/ρ).
      expectClose(v.chargeCoolerLoss!, 8000 * (v.engineMassFlow / 0.25) ** 2 * (2.4 / v.airDensity), 1e-9);
      expectClose(v.inletLoss!, 2000 * (v.engineMassFlow / 0.25) ** 2 * (1.225 / (v.ambientPressure / (R * v.compressorInletTemperature))), 1e-9);
    }
    // At 2000 rpm the engine passes a fraction of the reference flow: far less loss than 8 kPa, so a lower pressure ratio.
    expect(moving[0].chargeCoolerLoss!).toBeLessThan(2000);
    expect(moving[0].pressureRatio).toBeLessThan(fixed[0].pressureRatio);
  });

  it('reads a version-1 document’s plain losses as the same loss at every flow: the same answers as before', () => {
    const v1 = {
      schemaVersion: 1,
      engineLabel: 'old',
      notes: '',
      ...baseStudy(),
      losses: { inlet: 2000, chargeCooler: 8000 },
      plans: [
        { id: 'a', compressorMapId: null, name: 'Plan A', turbochargers: 1, compressorEfficiency: 0.72, exhaust: { ...exhaustOf(), downstreamLoss: 15_000 } },
      ],
    };
    const migrated = migrateStudyDocument(v1) as Record<string, unknown>;
    expect(migrated.schemaVersion).toBe(STUDY_SCHEMA_VERSION);
    expect(migrated.losses).toEqual({ inlet: { pressureLoss: 2000 }, chargeCooler: { pressureLoss: 8000 } });
    expect((migrated.plans as { exhaust: { downstreamLoss: unknown } }[])[0].exhaust.downstreamLoss).toEqual({ pressureLoss: 15_000 });
    expect(studyDocumentSchema.safeParse(migrated).success).toBe(true);
    expect(v1.losses).toEqual({ inlet: 2000, chargeCooler: 8000 }); // the stored document is not changed in place
    // A version-0 document (no version, plans naming their map in mapId) comes up both steps.
    const {
      schemaVersion: _v,
      engineLabel: _l,
      notes: _n,
      ...v0
    } = { ...v1, plans: [{ mapId: 'builtin-compressor-m58', name: 'Plan A', turbochargers: 1, compressorEfficiency: 0.72 }] };
    const fromV0 = migrateStudyDocument(v0) as Record<string, unknown>;
    expect(fromV0).toMatchObject({
      schemaVersion: STUDY_SCHEMA_VERSION,
      losses: { inlet: { pressureLoss: 2000 } },
      plans: [{ id: 'plan-1', compressorMapId: 'builtin-compressor-m58' }],
    });
    // The fixed form computes exactly as the plain numbers did: the loss is the loss at every point.
    const v = runStudy(parseStudyInput(baseStudy())).lines[0].points.map(solved);
    for (const p of v) expect(p.compressorInletPressure).toBe(p.ambientPressure - 2000);
  });

  it('keeps the compute contract’s plain Pa, and takes a loss at a stated flow there too', () => {
    const request = (losses: unknown) =>
      runComputeRequest(
        computeRequestSchema.parse({
          engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
          ambient: { pressure: 101_325, temperature: 298.15 },
          losses,
          points: [{ rpm: 6000, volumetricEfficiency: 0.95, boost: 150_000, manifoldTemperature: 320 }],
        }),
      ).points[0];
    const plain = request({ inlet: 2500, chargeCooler: 12_000 });
    expect(plain.compressorInletPressure).toBe(101_325 - 2500); // the contract's first form (docs/api.md)
    expect(plain.compressorOutletPressure).toBe(251_325 + 12_000);
    const scaled = request({ inlet: { pressureLoss: 2500, referenceMassFlow: 0.2, referenceDensity: 1.2 }, chargeCooler: 12_000 });
    const rhoIn = 101_325 / (R * 298.15);
    expectClose(scaled.compressorInletPressure, 101_325 - 2500 * (scaled.massFlow / 0.2) ** 2 * (1.2 / rhoIn), 1e-12); // Δp ∝ ṁ²/ρ by hand
  });
});

describe('humid air', () => {
  const hot = (relativeHumidity?: number) =>
    onePoint((s) => {
      s.scenarios[0].ambient =
        relativeHumidity === undefined ? { pressure: 101_325, temperature: 313.15 } : { pressure: 101_325, temperature: 313.15, relativeHumidity };
    });

  it('changes nothing at 0 % relative humidity: today’s answers', () => {
    const dry = solved(runStudy(parseStudyInput(hot())).lines[0].points[0]);
    const zero = solved(runStudy(parseStudyInput(hot(0))).lines[0].points[0]);
    expect(zero).toEqual(dry);
    expect(dry.humidityRatio).toBe(0);
    expect(dry.dryAirMassFlow).toBe(dry.engineMassFlow);
  });

  it('gives the manifold density psychrolib gives, and fuel and power from the dry air alone', () => {
    const dry = solved(runStudy(parseStudyInput(hot())).lines[0].points[0]);
    const v = solved(runStudy(parseStudyInput(hot(0.5))).lines[0].points[0]);
    const w = humidityRatioFromRelativeHumidity(313.15, 101_325, 0.5);
    expect(v.humidityRatio).toBe(w);
    psychrolib.SetUnitSystem(psychrolib.SI);
    // psychrolib (ASHRAE 2017 ch. 1 eq. 11) with R_da 287.042 against ISO 2533's 287.05287: within 4e-5.
    expectClose(v.airDensity, psychrolib.GetMoistAirDensity(320 - 273.15, w, v.manifoldPressure), 5e-5);
    expectClose(v.dryAirMassFlow!, v.engineMassFlow / (1 + w), 1e-12); // definition of W
    expectClose(v.fuelMassFlow!, v.dryAirMassFlow! / (0.85 * 14.7), 1e-12); // ṁ_f = ṁ_dry/(λ·AFR_s), petrol 14.7 (AFDC)
    // At 40 °C and 50 % the dry air is 3.8 % less than dry-air arithmetic says (psychrolib; the audit figure).
    expectClose(dry.fuelMassFlow! / v.fuelMassFlow! - 1, 0.0378, 5e-3);
    expectClose(dry.brakePower! / v.brakePower! - 1, 0.0378, 5e-3);
  });

  it('never raises the dry-air flow as humidity rises (fast-check)', () => {
    const model = undefined;
    fc.assert(
      fc.property(
        fc.double({ min: 263.15, max: 318.15, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 250_000, noNaN: true }),
        fc.boolean(),
        (temperature, a, b, boost, scaledLosses) => {
          const [low, high] = a <= b ? [a, b] : [b, a];
          const dryAir = (relativeHumidity: number) => {
            const study = baseStudy();
            study.scenarios[0].ambient = { pressure: 98_000, temperature, relativeHumidity };
            study.scenarios[0].boostSchedule[0].boost = [{ rpm: 2000, value: boost }];
            if (scaledLosses)
              study.losses = {
                inlet: { pressureLoss: 2500, referenceMassFlow: 0.25 },
                chargeCooler: { pressureLoss: 10_000, referenceMassFlow: 0.25, referenceDensity: 2.4 },
              };
            return runStudy(parseStudyInput(study), { compressorModels: [model] }).lines[0].points.map((p) => solved(p).dryAirMassFlow!);
          };
          const wetter = dryAir(high);
          dryAir(low).forEach((flow, i) => expect(wetter[i]).toBeLessThanOrEqual(flow * (1 + 1e-9))); // water vapour displaces air (Dalton)
        },
      ),
      { numRuns: 60 },
    );
  });

  it('refuses a humidity the air cannot hold, by field path', () => {
    const study = baseStudy();
    // At 11 km the ISA gives 22.6 kPa; saturated vapour at 67 °C is about 27 kPa (ASHRAE 2017 ch. 1 Table 3, from memory).
    study.scenarios[0].ambient = { altitude: 11_000, temperature: 340, relativeHumidity: 1 };
    expect(() => runStudy(parseStudyInput(study))).toThrow(/scenarios\.0\.ambient\.relativeHumidity/);
  });
});

describe('two-stroke trapping and injector dead time', () => {
  it('takes fuel and power from the trapped air while the compressor passes all the delivered air, worked by hand', () => {
    const study = onePoint((s) => {
      s.engine.strokes = 2;
      s.engine.trappingEfficiency = 0.7;
    });
    const v = solved(runStudy(parseStudyInput(study)).lines[0].points[0]);
    // Delivered: VE·ρ_man·V_d·N/60 for a two-stroke (Heywood 1988 §2.10, n_R = 1); trapped = 0.7 of it (Heywood §6.6).
    const delivered = (0.95 * (251_325 / (R * 320)) * 0.002 * 6000) / 60;
    expectClose(v.engineMassFlow, delivered, 1e-12);
    expectClose(v.massFlow, delivered, 1e-12); // the compressor passes all of it
    expectClose(v.trappedAirMassFlow!, 0.7 * delivered, 1e-12);
    expectClose(v.fuelMassFlow!, (0.7 * delivered) / (0.85 * 14.7), 1e-12); // λ of the trapped charge, petrol 14.7 (AFDC)
    expectClose(v.brakePower!, (0.33 * 0.7 * delivered * 44e6) / 14.7, 1e-12); // rich: the trapped air sets it, η_b 0.33, LHV 44 MJ/kg (Heywood App. D)
    expect(() => runStudy(parseStudyInput(onePoint((s) => (s.engine.trappingEfficiency = 0.7))))).toThrow(/engine\.trappingEfficiency/); // four-strokes: refused
  });

  it('adds the dead time of every injection to the duty, and counts the rating fluid’s density, worked by hand', () => {
    const study = onePoint((s) => {
      s.fuelSystem.injectors = {
        primary: { count: 4, ratedFlow: 1000 * CC_PER_MIN, ratedPressure: 3e5, ratingFluidDensity: 700, deadTime: { time: 0.0009, voltage: 14 } },
        fuelPressure: 3e5,
        regulator: 'manifold-referenced',
      };
    });
    const v = solved(runStudy(parseStudyInput(study)).lines[0].points[0]);
    // Capacity: 4 × 1000 cc/min × √(700/745) (orifice at one ΔP; petrol 745 kg/m³, fuel.ts); flow duty = Q_f/capacity;
    // duty = flow duty + 0.9 ms/(120/6000 s) = flow duty + 0.045 (one injection per cycle, four-stroke) (by hand).
    const capacity = 4 * 1000 * CC_PER_MIN * Math.sqrt(700 / 745);
    expectClose(v.injectorCapacity!, capacity, 1e-12);
    expectClose(v.injectorFlowDuty!, v.fuelVolumeFlow! / capacity, 1e-12);
    expectClose(v.injectorDuty!, v.fuelVolumeFlow! / capacity + 0.045, 1e-12);
    // Without either: the plain duty, exactly as before.
    const plain = solved(runStudy(parseStudyInput(onePoint())).lines[0].points[0]);
    expect(plain.injectorDuty).toBe(plain.fuelVolumeFlow! / (4 * 1000 * CC_PER_MIN));
  });
});

describe('the exhaust side an engineer accepts', () => {
  const compressor = compressorModelFromMap(demoCompressor('m58'));
  const run = (map: TurbineMap, change: (s: StudyInput) => void = () => {}) => {
    const study = exhaustStudy([exhaustOf()]);
    change(study);
    return runStudy(parseStudyInput(study), { compressorModels: [compressor], turbineModels: [turbineModelFromMap(map)] }).lines[0];
  };

  /** A line of the map read at an expansion ratio: straight between its points, held at its end beyond them (docs/physics.md §8). */
  const onLine = (curve: TurbineCurve, er: number): number => {
    const pts = curve.points;
    if (er <= pts[0].expansionRatio) return pts[0].efficiency!;
    if (er >= pts[pts.length - 1].expansionRatio) return pts[pts.length - 1].efficiency!;
    let i = 0;
    while (er > pts[i + 1].expansionRatio) i++;
    const a = pts[i];
    const b = pts[i + 1];
    return a.efficiency! + ((er - a.expansionRatio) / (b.expansionRatio - a.expansionRatio)) * (b.efficiency! - a.efficiency!);
  };

  it('reads the turbine at the compressor’s shaft speed, between two lines, as by hand', () => {
    const map = demoTurbine('ar082-single');
    const line = run(map);
    let checked = 0;
    for (const v of valuesOf(line)) {
      if (!v.reachable || v.turbineSpeedReading?.basis !== 'speed-lines' || v.shaftSpeed === null) continue;
      const speeds = map.curves.map((c) => c.points[0].speed!);
      const lower = map.curves[speeds.filter((s) => s <= v.shaftSpeed!).length - 1];
      const upper = map.curves[speeds.filter((s) => s <= v.shaftSpeed!).length];
      const a = onLine(lower, v.expansionRatio!);
      const b = onLine(upper, v.expansionRatio!);
      // Hand interpolation: each line straight in ER (data/maps/turbine-t64-ar082-single.csv), then straight in speed.
      const sa = lower.points[0].speed!;
      const sb = upper.points[0].speed!;
      expectClose(v.turbineEfficiency!, a + ((v.shaftSpeed - sa) / (sb - sa)) * (b - a), 1e-9);
      expect(v.turbineSpeedReading!.shaftSpeed).toBe(v.shaftSpeed);
      checked++;
    }
    expect(checked).toBeGreaterThan(3);
  });

  it('holds the nearest line outside the lines and says so; the mean of the lines only where no shaft speed is known', () => {
    const map = demoTurbine('ar082-single');
    // The same map with its lines labelled 1.5 times faster (invented): the engine's shaft speeds fall below the lowest line.
    const faster: TurbineMap = { ...map, curves: map.curves.map((c) => ({ ...c, points: c.points.map((p) => ({ ...p, speed: p.speed! * 1.5 })) })) };
    const line = run(faster);
    const held = valuesOf(line).filter((v) => v.turbineSpeedReading?.basis === 'held-at-lowest-line');
    expect(held.length).toBeGreaterThan(3);
    for (const v of held) {
      expect(v.turbineSpeedReading!.lowerSpeed).toBe(90_000); // the lowest line, 60 000 × 1.5
      expect(v.turbineEfficiency).toBe(onLine(faster.curves[0], v.expansionRatio!)); // that line read as it is
    }
    expect(line.points.some((p) => p.findings.some((f) => f.code === 'turbine-speed-outside-lines'))).toBe(true);
    // No compressor map: no shaft speed, so the mean of the lines.
    const study = exhaustStudy([exhaustOf()]);
    const noMap = runStudy(parseStudyInput(study), { turbineModels: [turbineModelFromMap(map)] }).lines[0];
    for (const v of valuesOf(noMap)) if (v.turbineSpeedReading) expect(v.turbineSpeedReading.basis).toBe('mean-of-lines');
  });

  it('expands the products of the fuel burnt, at T3, with the point’s own cp and γ in the turbine power', () => {
    const map = demoTurbine('ar082-single');
    for (const fuel of [{ kind: 'petrol' }, { kind: 'ethanol-blend', ethanolPercent: 85 }, { kind: 'methanol' }] as const) {
      const line = run(map, (s) => (s.fuelSystem.fuel = fuel));
      for (const v of valuesOf(line).filter((x) => x.reachable && x.exhaustCase === 'gate-open')) {
        const gas = exhaustGasAt({ fuel, lambda: v.lambda!, temperature: v.turbineInletTemperature! });
        expect(v.exhaustGasCp).toBe(gas.cp);
        expect(v.exhaustGasGamma).toBe(gas.gamma);
        // P_t = ṁ_t·cp_e·T3·η_t·(1 − ER^(−(γe−1)/γe)) (NASA Glenn matching; Isermann 2017 eq. 5.4.17), by hand.
        const share = 1 - v.expansionRatio! ** (-(gas.gamma - 1) / gas.gamma);
        expectClose(v.turbinePower!, v.turbineMassFlow! * gas.cp * v.turbineInletTemperature! * v.turbineEfficiency! * share, 1e-9);
      }
    }
  });

  it('applies the mechanical efficiency once: not again where the map’s efficiency counts the bearings', () => {
    const base = demoTurbine('ar082-single');
    const withBearings = run({ ...base, efficiencyKind: 'with-bearing-losses' });
    const aerodynamic = run({ ...base, efficiencyKind: 'aerodynamic' });
    const { efficiencyKind: _k, ...unstatedMap } = base;
    const unstated = run(unstatedMap);
    expect(withBearings.context.exhaust!.mechanicalEfficiency).toBe(1);
    expect(aerodynamic.context.exhaust!.mechanicalEfficiency).toBe(0.95); // the Plan's (exhaustOf)
    expect(unstated.context.exhaust!.mechanicalEfficiency).toBe(0.95); // absent reads as aerodynamic only (docs/map-format.md)
    for (const [line, etaM] of [
      [withBearings, 1],
      [aerodynamic, 0.95],
    ] as const) {
      for (const v of valuesOf(line).filter((x) => x.reachable && x.exhaustCase === 'gate-open')) expectClose(etaM * v.turbinePower!, v.compressorPower!, 1e-6); // η_m·P_t = P_c
    }
    expect(withBearings.points[0].findings.some((f) => f.code === 'mechanical-efficiency-in-map')).toBe(true);
    expect(aerodynamic.points[0].findings.some((f) => f.code === 'mechanical-efficiency-in-map')).toBe(false);
    // The same figures read as with bearing losses give the turbine 1/0.95 more power at the shaft: boost comes no later.
    expect(withBearings.exhaust!.boostThresholdRpm!).toBeLessThanOrEqual(aerodynamic.exhaust!.boostThresholdRpm!);
  });

  it('scales the loss after the turbine with the exhaust flow over its density at T3', () => {
    const line = run(
      demoTurbine('ar082-single'),
      (s) => (s.plans[0].exhaust!.downstreamLoss = { pressureLoss: 15_000, referenceMassFlow: 0.3, referenceDensity: 0.3 }),
    );
    for (const v of valuesOf(line).filter((x) => x.reachable && x.exhaustCase !== null)) {
      const density = v.ambientPressure / (v.exhaustGasConstant! * v.turbineInletTemperature!);
      // Δp = Δp_ref·(ṁ_ex/ṁ_ref)²·ρ_ref/ρ with the whole engine's exhaust flow (one turbocharger here), by hand.
      expectClose(v.downstreamLoss!, 15_000 * ((v.engineMassFlow + v.fuelMassFlow!) / 0.3) ** 2 * (0.3 / density), 1e-12);
      expectClose(v.turbineOutletPressure!, v.ambientPressure + v.downstreamLoss!, 1e-12);
    }
  });

  it('gives humid air’s exhaust its water, and carries cp, γ and the humidity ratio on every point', () => {
    const line = run(demoTurbine('ar082-single'), (s) => (s.scenarios[0].ambient = { pressure: 101_325, temperature: 308.15, relativeHumidity: 0.7 }));
    const w = humidityRatioFromRelativeHumidity(308.15, 101_325, 0.7);
    for (const v of valuesOf(line)) {
      expect(v.humidityRatio).toBe(w);
      if (!v.reachable || v.exhaustGasCp === null) continue;
      expect(v.exhaustGasCp).toBe(exhaustGasAt({ fuel: { kind: 'petrol' }, lambda: v.lambda!, temperature: v.turbineInletTemperature!, humidityRatio: w }).cp);
    }
    expect(humidAirGas(w).gasConstant).toBeGreaterThan(R);
  });
});
