import { describe, expect, it } from 'vitest';
import { runComputeRequest, solveComputeRequest } from '#shared/compute/run';
import { isaPressure, isaTemperature } from '#shared/physics';
import { computeRequestSchema, type ComputeRequest } from '#shared/schemas/compute';
import { expectClose } from '../expect-close';

const compute = (req: unknown) => computeRequestSchema.parse(req) as ComputeRequest;

describe('one point through the compute contract', () => {
  const checkRow = {
    engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
    ambient: { pressure: 100_000, temperature: 288.15 },
    points: [{ rpm: 6000, volumetricEfficiency: 0.9, boost: 100_000, manifoldTemperature: 320, compressorEfficiency: 0.75 }],
  };

  it('reproduces the engine airflow row: ρ 2.1773 kg/m³, ṁ 0.19596 kg/s at 200 kPa and 320 K', () => {
    const [p] = runComputeRequest(compute(checkRow)).points;
    expectClose(p.manifoldPressure, 200_000, 1e-12); // 100 kPa ambient + 100 kPa boost (definition of gauge)
    expectClose(p.airDensity, 2.1773, 2e-5); // ideal gas, physics note check table
    expectClose(p.massFlow, 0.19596, 2e-5); // Heywood (1988) §2.10, physics note check table
  });

  it('reproduces the compressor row: PR 2 from 100 to 200 kPa, T2 372.30 K at η 0.75 and T1 288.15 K', () => {
    const [p] = runComputeRequest(compute(checkRow)).points;
    expectClose(p.pressureRatio, 2, 1e-12); // 200/100 kPa with no losses (definition)
    expectClose(p.compressorOutletTemperature, 372.3, 2e-5); // NASA Glenn isentropic relation, physics note check table
    // P_c with this project's cp = γR/(γ−1) = 1004.685 J/(kg·K) on ṁ = 0.19596 kg/s (hand calculation from the same row)
    expectClose(p.compressorPower, 0.19596 * 1004.685 * (372.3 - 288.15), 1e-4);
  });

  it('uses the map reference given, and ISA sea level when none is given', () => {
    const req = { ...checkRow, ambient: { pressure: 95_000, temperature: 308.15 }, points: [{ ...checkRow.points[0], boost: 105_000 }] };
    const withRef = runComputeRequest(compute({ ...req, mapReference: { temperature: 298.15, pressure: 100_000 } })).points[0];
    const standard = runComputeRequest(compute(req)).points[0];
    expectClose(withRef.correctedMassFlow / withRef.massFlow, 0.214 / 0.2, 5e-4); // corrected-flow row, physics note check table (298.15 K, 100 kPa)
    expectClose(standard.correctedMassFlow / standard.massFlow, 0.2206 / 0.2, 5e-4); // corrected-flow row (288.15 K, 101.325 kPa)
  });

  it('halves the flow per turbocharger for two in parallel and keeps the pressure ratio', () => {
    const one = runComputeRequest(compute(checkRow)).points[0];
    const two = runComputeRequest(compute({ ...checkRow, turbochargers: 2 })).points[0];
    expectClose(two.massFlow, one.massFlow / 2, 1e-12); // equal split (physics note §2)
    expectClose(two.correctedMassFlow, one.correctedMassFlow / 2, 1e-12); // equal split
    expectClose(two.compressorPower, one.compressorPower / 2, 1e-12); // power per turbocharger
    expect(two.pressureRatio).toBe(one.pressureRatio); // same pressures (definition)
  });

  it('doubles the airflow of a two-stroke', () => {
    const four = runComputeRequest(compute(checkRow)).points[0];
    const two = runComputeRequest(compute({ ...checkRow, engine: { ...checkRow.engine, strokes: 2 } })).points[0];
    expectClose(two.massFlow, 2 * four.massFlow, 1e-12); // n_R = 1 vs 2, Heywood (1988) §2.10
  });

  it('adds fuel, brake and wheel power only when asked', () => {
    const plain = runComputeRequest(compute(checkRow)).points[0];
    expect(plain).not.toHaveProperty('fuelMassFlow'); // contract: optional results absent without fuel
    const fuel = runComputeRequest(compute({ ...checkRow, fuel: { kind: 'petrol', lambda: 1, brakeThermalEfficiency: 0.33, drivetrainLoss: 0.1 } })).points[0];
    expectClose(fuel.fuelMassFlow!, 0.19596 / 14.7, 2e-5); // ṁ_air/(λ·AFR_s) with AFR_s 14.7 (AFDC)
    expectClose(fuel.brakePower!, (0.33 * 0.19596 * 44e6) / 14.7, 2e-5); // η_b·ṁ_air·LHV/AFR_s (physics note §4)
    expectClose(fuel.wheelPower!, 0.9 * fuel.brakePower!, 1e-12); // definition of drivetrain loss
    const bsfc = runComputeRequest(compute({ ...checkRow, fuel: { kind: 'petrol', lambda: 1, bsfc: 1 / (0.33 * 44e6) } })).points[0];
    expectClose(bsfc.brakePower!, fuel.brakePower!, 1e-12); // bsfc = 1/(η_b·LHV) (physics note §4)
    expect(bsfc).not.toHaveProperty('wheelPower'); // no drivetrain loss given
  });

  it('takes the ISA pressure at altitude and the temperature of the day when given', () => {
    const { context } = solveComputeRequest(compute({ ...checkRow, ambient: { altitude: 1500, temperature: 303.15 } }));
    expectClose(context.ambient.pressure, isaPressure(1500), 1e-12); // ISO 2533 (tested against the table elsewhere)
    expect(context.ambient.temperature).toBe(303.15); // given (design)
    const isaDay = solveComputeRequest(compute({ ...checkRow, ambient: { altitude: 1500 } })).context;
    expectClose(isaDay.ambient.temperature, isaTemperature(1500), 1e-12); // ISO 2533: 278.4 K at 1500 m
  });
});
