import { describe, expect, it } from 'vitest';
import { criticalPressureRatio } from '#shared/physics/gas';
import { orificeFlowFunction, orificeMassFlux, valveArea, valveDiameter, wastegateDiameterFor, wastegateMassFlow } from '#shared/physics/wastegate';
import { TURBINE_GAS, type GasProperties } from '#shared/physics/turbine';
import { expectClose } from '../expect-close';

/** The air of the physics note's check row: γ 1.4, R 287 J/(kg·K). */
const AIR_287: GasProperties = { gamma: 1.4, cp: 1004.5, gasConstant: 287 };
/** A valve of exactly 1 cm² of flow area. */
const ONE_CM2_DIAMETER = valveDiameter(1e-4);

describe('wastegate valves as compressible orifices', () => {
  it('gives the choked check value: 1 cm², 200 kPa, 900 K, γ 1.4, R 287 → 0.02694 kg/s', () => {
    const flow = wastegateMassFlow({
      gates: 1,
      valveDiameter: ONE_CM2_DIAMETER,
      dischargeCoefficient: 1,
      upstreamPressure: 200_000,
      upstreamTemperature: 900,
      downstreamPressure: 100_000,
      gas: AIR_287,
    });
    expect(flow.choked).toBe(true); // 0.5 ≤ 0.52828 (NACA Report 1135)
    // 0.026946 kg/s; the table's 0.02694 is cut at 4 figures: one unit in the 4th figure.
    expectClose(flow.massFlow, 0.02694, 4e-4); // physics note check table (NASA Glenn "mass flow choking")
  });

  it('gives the critical pressure ratios for γ 1.4 and 1.33', () => {
    expectClose(criticalPressureRatio(1.4), 0.52828, 1e-5); // isentropic flow tables, NACA Report 1135
    expectClose(criticalPressureRatio(1.33), 0.5404, 1e-4); // isentropic flow tables, NACA Report 1135
    expectClose(criticalPressureRatio(TURBINE_GAS.gamma), 0.5398, 1e-4); // (2/(γ+1))^(γ/(γ−1)) at γ = 4/3: (6/7)^4 (closed form)
  });

  it('is continuous where the choked and subsonic formulas meet, for γ 1.4 and 4/3', () => {
    for (const gas of [AIR_287, TURBINE_GAS]) {
      const critical = criticalPressureRatio(gas.gamma);
      const choked = orificeMassFlux(200_000, 900, 200_000 * critical * (1 - 1e-9), gas);
      const subsonic = orificeMassFlux(200_000, 900, 200_000 * critical * (1 + 1e-9), gas);
      expect(choked.choked).toBe(true); // below the critical ratio (definition)
      expect(subsonic.choked).toBe(false); // above it (definition)
      expectClose(subsonic.massFlux, choked.massFlux, 1e-8); // the two isentropic forms agree at p*/p0 (any compressible-flow text)
    }
  });

  it('passes nothing without a pressure drop and more with more drop, up to choking', () => {
    expect(orificeFlowFunction(1, 1.4).value).toBe(0); // no pressure difference, no flow (definition)
    expect(orificeFlowFunction(1.2, 1.4).value).toBe(0); // reverse difference: a gate does not flow backwards here (definition)
    const ratios = [0.99, 0.9, 0.8, 0.7, 0.6, criticalPressureRatio(1.4)];
    const flux = ratios.map((r) => orificeFlowFunction(r, 1.4).value);
    for (let i = 1; i < flux.length; i++) expect(flux[i]).toBeGreaterThan(flux[i - 1]); // flow rises as the ratio falls to critical (isentropic nozzle)
    expect(orificeFlowFunction(0.3, 1.4).value).toBe(orificeFlowFunction(0.5, 1.4).value); // choked: independent of downstream (definition)
  });

  it('sizes a valve that passes exactly the flow asked, choked and not', () => {
    for (const downstreamPressure of [100_000, 170_000]) {
      const conditions = { upstreamPressure: 200_000, upstreamTemperature: 1100, downstreamPressure, gas: TURBINE_GAS };
      const size = wastegateDiameterFor({ ...conditions, massFlow: 0.05, gates: 1, dischargeCoefficient: 0.8 })!;
      expect(size.choked).toBe(downstreamPressure === 100_000); // 0.5 < 0.5398 < 0.85 (NACA Report 1135)
      const back = wastegateMassFlow({ ...conditions, gates: 1, valveDiameter: size.diameter, dischargeCoefficient: 0.8 });
      expectClose(back.massFlow, 0.05, 1e-12); // the sizing inverts the flow relation (definition)
      expectClose(valveArea(size.diameter), size.area, 1e-12); // A = π·d²/4 (definition)
    }
  });

  it('splits the flow between two gates: each needs 1/√2 of one gate’s diameter', () => {
    const conditions = { upstreamPressure: 220_000, upstreamTemperature: 1150, downstreamPressure: 115_000, gas: TURBINE_GAS };
    const one = wastegateDiameterFor({ ...conditions, massFlow: 0.06, gates: 1, dischargeCoefficient: 0.8 })!;
    const two = wastegateDiameterFor({ ...conditions, massFlow: 0.06, gates: 2, dischargeCoefficient: 0.8 })!;
    expectClose(two.diameter, one.diameter / Math.SQRT2, 1e-12); // half the area each (definition)
    expectClose(two.massFlowPerGate, 0.03, 1e-12); // an equal share (definition)
  });

  it('needs no valve for no flow, and none can pass flow without a pressure drop', () => {
    const conditions = { upstreamPressure: 150_000, upstreamTemperature: 1000, downstreamPressure: 110_000 };
    expect(wastegateDiameterFor({ ...conditions, massFlow: 0, gates: 1, dischargeCoefficient: 0.8 })!.diameter).toBe(0); // definition
    expect(wastegateDiameterFor({ ...conditions, downstreamPressure: 150_000, massFlow: 0.01, gates: 1, dischargeCoefficient: 0.8 })).toBeNull(); // p3 = p4: no flow at any size (definition)
  });
});
