import { describe, expect, it } from 'vitest';
import { dutyCycle, injectorPressureDifference, railGaugePressure, scaleInjectorFlow, setCapacity } from '../../../shared/physics';
import { expectClose } from './expect-close';

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
});
