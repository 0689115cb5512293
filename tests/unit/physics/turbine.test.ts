import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  expansionRatioForPower,
  exhaustMassFlow,
  flowParameter,
  TURBINE_GAS,
  turbinePower,
  turbineSwallowingFlow,
  type GasProperties,
} from '#shared/physics/turbine';
import { expectClose } from '../expect-close';

/** The gas of the check example: cp 1148 J/(kg·K), γ 4/3. */
const CHECK_GAS: GasProperties = { gamma: 4 / 3, cp: 1148, gasConstant: 287 };

describe('turbine power and swallowing capacity', () => {
  it('uses the hot-gas properties of the gas-turbine texts: γ 1.333, cp 1148 J/(kg·K), R 287', () => {
    expectClose(TURBINE_GAS.gamma, 1.333, 3e-4); // Saravanamuttoo, Gas Turbine Theory: combustion gases 1.333
    expectClose(TURBINE_GAS.cp, 1148, 1e-12); // Saravanamuttoo, Gas Turbine Theory: 1.148 kJ/(kg·K)
    expectClose(TURBINE_GAS.gasConstant, 287, 1e-12); // R = cp·(γ−1)/γ = 1148/4 (closed form)
  });

  it('gives ER 1.449 for the check example: P_c 16.91 kW, ṁ_t 0.2133 kg/s, T3 1173 K, η_t 0.70, η_m 0.95', () => {
    // The check table's compressor row gives P_c 16.91 kW; the turbine must give P_c/η_m.
    const er = expansionRatioForPower({ power: 16_910 / 0.95, massFlow: 0.2133, inletTemperature: 1173, efficiency: 0.7, gas: CHECK_GAS })!;
    expectClose(er, 1.449, 3e-4); // turbine power equation solved for ER (physics note §5), to the example's 4 figures
    const back = turbinePower({ massFlow: 0.2133, inletTemperature: 1173, expansionRatio: er, efficiency: 0.7, gas: CHECK_GAS });
    expectClose(0.95 * back, 16_910, 1e-12); // η_m·P_t = P_c at that ratio (NASA Glenn compressor–turbine matching)
  });

  it('gives no power at ER 1, more as ER rises, and never more than ṁ·cp·T3·η (fast-check)', () => {
    expect(turbinePower({ massFlow: 0.2, inletTemperature: 1100, expansionRatio: 1, efficiency: 0.7 })).toBe(0); // 1 − 1^(−k) = 0 (closed form)
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        fc.double({ min: 700, max: 1400, noNaN: true }),
        fc.double({ min: 0.3, max: 0.85, noNaN: true }),
        fc.double({ min: 1.0001, max: 5, noNaN: true }),
        fc.double({ min: 0.001, max: 1, noNaN: true }),
        (massFlow, t3, eta, er, step) => {
          const p = (x: number) => turbinePower({ massFlow, inletTemperature: t3, expansionRatio: x, efficiency: eta });
          expect(p(er)).toBeGreaterThan(0);
          expect(p(er + step)).toBeGreaterThan(p(er)); // 1 − ER^(−k) rises with ER (closed form)
          expect(p(er)).toBeLessThan(massFlow * TURBINE_GAS.cp * t3 * eta); // the limit of an infinite ratio (closed form)
          const back = expansionRatioForPower({ power: p(er), massFlow, inletTemperature: t3, efficiency: eta })!;
          expectClose(back, er, 1e-9); // the inverse returns the ratio (closed form)
        },
      ),
    );
  });

  it('scales the power with the pulse-energy factor, and has no ratio for an impossible power', () => {
    const base = { massFlow: 0.2, inletTemperature: 1100, expansionRatio: 2, efficiency: 0.7 };
    expectClose(turbinePower({ ...base, pulseFactor: 1.1 }), 1.1 * turbinePower(base), 1e-12); // a factor on turbine energy (physics note §5)
    expect(expansionRatioForPower({ power: 0.2 * 1148 * 1100 * 0.7, massFlow: 0.2, inletTemperature: 1100, efficiency: 0.7 })).toBeNull(); // needs ER → ∞ (closed form)
  });

  it('swallows FP·ER·p4/√T3, consistent with the flow parameter’s definition', () => {
    const fp = 4e-5;
    const m = turbineSwallowingFlow(fp, 2, 115_000, 1150);
    expectClose(flowParameter(m, 1150, 2 * 115_000), fp, 1e-12); // FP = ṁ·√T3/p3 with p3 = ER·p4 (physics note §5)
    expectClose(exhaustMassFlow(0.2, 0.02), 0.22, 1e-12); // air plus fuel (mass balance)
  });
});
