import psychrolib from 'psychrolib';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  AIR_CP,
  AIR_GAMMA,
  AIR_GAS_CONSTANT,
  DRY_AIR,
  dryAirMassFlow,
  humidAirGas,
  humidityRatioFromRelativeHumidity,
  saturationVapourPressure,
} from '#shared/physics';
import { expectClose } from '../expect-close';

describe('humid air', () => {
  it('holds the saturation pressure and humidity ratio ASHRAE gives at 40 °C', () => {
    // ASHRAE Handbook Fundamentals 2017 ch. 1 Table 3: p_ws(40 °C) = 7.3851 kPa (from memory); the eq. 6 fit lies within 0.05 %.
    expectClose(saturationVapourPressure(313.15), 7385.1, 5e-4);
    // W = 0.621945·p_w/(p − p_w) with p_w = RH·p_ws (ASHRAE 2017 ch. 1 eqs. 20 and 24), worked by hand from the fit's p_ws.
    const pw = 0.5 * saturationVapourPressure(313.15);
    expectClose(humidityRatioFromRelativeHumidity(313.15, 101_325, 0.5), (0.621945 * pw) / (101_325 - pw), 1e-12);
    psychrolib.SetUnitSystem(psychrolib.SI);
    expectClose(humidityRatioFromRelativeHumidity(313.15, 101_325, 0.5), psychrolib.GetHumRatioFromRelHum(40, 0.5, 101_325), 1e-12); // psychrolib (ASHRAE 2017 ch. 1)
  });

  it('gives the density psychrolib gives, within the two standards’ dry-air gas constants', () => {
    psychrolib.SetUnitSystem(psychrolib.SI);
    // ρ = (1 + W)/v with v = R_da·T·(1 + 1.607858·W)/p (ASHRAE 2017 ch. 1 eqs. 11 and 26, psychrolib GetMoistAirDensity).
    // psychrolib takes R_da = 287.042 (ASHRAE), Spoolbook 287.05287 (ISO 2533): they differ by 3.8e-5.
    for (const [t, p, rh] of [
      [313.15, 101_325, 0.5],
      [293.15, 101_325, 0.8],
      [303.15, 84_556, 0.3],
      [273.15, 95_000, 1],
      [323.15, 100_000, 0.2],
    ] as const) {
      const w = humidityRatioFromRelativeHumidity(t, p, rh);
      const density = p / (humidAirGas(w).gasConstant * t);
      expectClose(density, psychrolib.GetMoistAirDensity(t - 273.15, w, p), 5e-5);
    }
  });

  it('overstates dry air by 3.8 % at 40 °C and 50 % relative humidity when humidity is ignored', () => {
    // The audit's figure (issue: psychrolib, at 40 °C and 50 % RH): dry air per m³ of humid air against dry air at the same p and T.
    const w = humidityRatioFromRelativeHumidity(313.15, 101_325, 0.5);
    const dryAirInHumid = 101_325 / (humidAirGas(w).gasConstant * 313.15) / (1 + w);
    const dry = 101_325 / (AIR_GAS_CONSTANT * 313.15);
    expectClose(dry / dryAirInHumid - 1, 0.0378, 5e-3); // psychrolib's numbers give 3.78 %
  });

  it('is exactly dry air at 0 % relative humidity: today’s answers stand', () => {
    expect(humidityRatioFromRelativeHumidity(313.15, 101_325, 0)).toBe(0); // psychrolib alone would give its 1e-7 floor
    expect(humidAirGas(0)).toBe(DRY_AIR);
    expect(DRY_AIR).toEqual({ humidityRatio: 0, gasConstant: AIR_GAS_CONSTANT, cp: AIR_CP, gamma: AIR_GAMMA }); // gas.ts constants
    expect(dryAirMassFlow(0.2, 0)).toBe(0.2);
  });

  it('gives a mixture gas constant and cp worked by hand', () => {
    const w = 0.02;
    // R = R_a·(1 + W/0.621945)/(1 + W), cp = (cp_a + 1860·W)/(1 + W) (ASHRAE 2017 ch. 1 eqs. 20 and 32), by hand:
    const r = (287.05287 * (1 + 0.02 / 0.621945)) / 1.02;
    const cp = (1004.685 + 1860 * 0.02) / 1.02;
    expectClose(humidAirGas(w).gasConstant, r, 1e-12);
    expectClose(humidAirGas(w).cp, cp, 1e-6);
    expectClose(humidAirGas(w).gamma, cp / (cp - r), 1e-6);
    expectClose(dryAirMassFlow(0.204, 0.02), 0.2, 1e-12); // ṁ/(1 + W) (definition of the humidity ratio)
  });

  it('refuses air more humid than the pressure allows', () => {
    // At 60 °C saturation is about 19.9 kPa (ASHRAE 2017 ch. 1 Table 3, from memory): 15 kPa of air cannot hold it.
    expect(humidityRatioFromRelativeHumidity(333.15, 15_000, 1)).toBeNaN();
  });

  it('never holds more dry air per cubic metre as humidity rises (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 250, max: 330, noNaN: true }),
        fc.double({ min: 60_000, max: 110_000, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (t, p, a, b) => {
          const [low, high] = a <= b ? [a, b] : [b, a];
          const dryPerCubicMetre = (rh: number) => {
            const w = humidityRatioFromRelativeHumidity(t, p, rh);
            return p / (humidAirGas(w).gasConstant * t) / (1 + w);
          };
          expect(dryPerCubicMetre(high)).toBeLessThanOrEqual(dryPerCubicMetre(low) * (1 + 1e-12)); // water vapour displaces air (Dalton)
        },
      ),
      { numRuns: 300 },
    );
  });
});
