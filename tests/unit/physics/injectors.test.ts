import { describe, expect, it } from 'vitest';
import {
  dutyCycle,
  dutyWithDeadTime,
  injectionPeriod,
  injectorPressureDifference,
  railGaugePressure,
  ratingFluidFactor,
  scaleInjectorFlow,
  setCapacity,
} from '#shared/physics';
import { expectClose } from '../expect-close';

describe('injectors', () => {
  it('scales 550 cc/min at 3 bar to 635.1 cc/min at 4 bar', () => {
    expectClose(scaleInjectorFlow(550, 3e5, 4e5), 635.1, 1e-4); // √ΔP relation, physics note check table
  });

  it('holds the difference with a 1:1 regulator and loses it to boost on a fixed rail', () => {
    const base = { fuelPressure: 3e5, manifoldPressure: 250_000, ambientPressure: 100_000 };
    expect(injectorPressureDifference({ ...base, regulator: 'manifold-referenced' })).toBe(3e5); // definition of a 1:1 regulator
    expect(injectorPressureDifference({ ...base, regulator: 'fixed-rail' })).toBe(150_000); // 100 + 300 − 250 kPa (definition)
    expect(railGaugePressure('manifold-referenced', 3e5, 150_000)).toBe(450_000); // base plus boost (definition)
    expect(railGaugePressure('fixed-rail', 3e5, 150_000)).toBe(3e5); // definition
  });

  it('adds up a set and divides for duty', () => {
    const set = { count: 4, ratedFlow: 1e-5, ratedPressure: 3e5 };
    expectClose(setCapacity(set, 3e5), 4e-5, 1e-12); // count × rated flow at the rated pressure (definition)
    expectClose(dutyCycle(3e-5, 4e-5), 0.75, 1e-12); // definition
  });

  it('passes less of a denser fuel than of its lighter rating fluid at the same pressure difference', () => {
    // Orifice flow Q = C_d·A·√(2ΔP/ρ): rated 1000 cc/min with a 700 kg/m³ test fluid, E85 at 782 kg/m³
    // flows 1000·√(700/782) = 946.1 cc/min (by hand).
    const set = { count: 1, ratedFlow: 1000, ratedPressure: 3e5, ratingFluidDensity: 700 };
    expectClose(ratingFluidFactor(set, 782), Math.sqrt(700 / 782), 1e-12);
    expectClose(setCapacity(set, 3e5, 782), 946.11, 1e-4);
    expect(setCapacity({ count: 1, ratedFlow: 1000, ratedPressure: 3e5 }, 3e5, 782)).toBe(1000); // no rating fluid named: rated with the fuel itself
  });

  it('adds the dead time of every injection to the duty, worked by hand', () => {
    // Four-stroke at 7000 rpm: one injection every 2 revolutions, 120/7000 s = 17.143 ms (Heywood 1988 §2.10 for n_R).
    expectClose(injectionPeriod(7000, 2), 0.0171429, 1e-5);
    // A flow duty of 70 % plus 0.8 ms lost per opening: 0.70 + 0.8/17.143 = 74.67 % (by hand).
    expectClose(dutyWithDeadTime(0.7, 0.0008, injectionPeriod(7000, 2)), 0.74667, 1e-5);
    // A two-stroke injects every revolution: 60/7000 s = 8.571 ms, so the same dead time costs twice as much (by hand).
    expectClose(dutyWithDeadTime(0.7, 0.0008, injectionPeriod(7000, 1)), 0.79333, 1e-5);
  });
});
