import { describe, expect, it } from 'vitest';
import { GRAVITY, roadLoad, tractionLimit } from '#shared/drive/traction';
import type { Vehicle } from '#shared/drive/vehicle';
import { expectClose } from '../expect-close';

/** An invented car: 1500 kg, 60 % of its weight on the front axle, h/L = 0.5/2.5 = 0.2. */
const car = (change: Partial<Vehicle> = {}): Vehicle => ({
  mass: 1500,
  drivenAxle: 'front',
  drivenAxleWeightShare: 0.6,
  cgHeight: 0.5,
  wheelbase: 2.5,
  tyreRadius: 0.3,
  grip: 1.2,
  gearRatios: [3, 2],
  finalDrive: 4,
  shiftRpm: 7000,
  shiftTime: 0.2,
  dragArea: 0,
  rollingResistance: 0,
  ...change,
});
const still = { drag: 0, rolling: 0 };

describe('the traction limit with longitudinal load transfer', () => {
  it('matches the worked front-drive example, and the axle load it leaves is exactly what the tyres need', () => {
    // Gillespie 1992, "Fundamentals of Vehicle Dynamics", ch. 2, traction-limited acceleration of a
    // front-drive car: Fx = μ·W·(c/L)/(1 + μ·h/L), with W·c/L the front's static load; by hand:
    // W = 1500·9.80665 = 14 709.975 N, 1.2·0.6·W/(1 + 1.2·0.2) = 10 591.18/1.24 = 8541.27 N.
    const limit = tractionLimit(car(), still);
    expectClose(limit.force, 8541.27, 1e-5, { what: 'front-drive limit' });
    expect(limit.limitedBy).toBe('grip');
    // The same chapter's load transfer ΔW = m·a·h/L = Fx·h/L = 1708.25 N off the front axle (by hand).
    const a = limit.force / 1500;
    expectClose(0.6 * 1500 * GRAVITY - limit.frontLoad, (1500 * a * 0.5) / 2.5, 1e-12, { what: 'load transfer m·a·h/L' });
    expectClose(limit.frontLoad * 1.2, limit.force, 1e-12, { what: 'μ·N_front = Fx at the limit (definition)' });
  });

  it('matches the rear-drive form, and a rear-drive car passes more than a front-drive one with the same static load on its driven axle', () => {
    // Gillespie 1992 ch. 2, rear drive: Fx = μ·W·(b/L)/(1 − μ·h/L); by hand 1.2·0.6·W/(1 − 0.24) = 13 935.76 N.
    const rear = tractionLimit(car({ drivenAxle: 'rear' }), still);
    expectClose(rear.force, 13935.76, 1e-5, { what: 'rear-drive limit' });
    // By construction: acceleration moves load onto the rear axle and off the front.
    expect(rear.force).toBeGreaterThan(tractionLimit(car(), still).force);
  });

  it('is the fixed point of F = μ·N(F) with drag and rolling resistance: iteration lands on the closed form', () => {
    const v = car({ dragArea: 0.7, rollingResistance: 0.015 });
    const load = roadLoad(v, 30, 1.2);
    // Drag ½·ρ·CdA·v² = 0.5·1.2·0.7·900 = 378 N; rolling f·m·g = 0.015·1500·9.80665 = 220.65 N (definitions, by hand).
    expectClose(load.drag, 378, 1e-12, { what: 'drag' });
    expectClose(load.rolling, 220.649625, 1e-9, { what: 'rolling resistance' });
    let f = 0;
    for (let i = 0; i < 200; i++) {
      const accel = (f - load.drag - load.rolling) / v.mass;
      const frontLoad = 0.6 * v.mass * GRAVITY - (v.mass * accel * v.cgHeight) / v.wheelbase; // ΔW = m·a·h/L (Gillespie 1992 ch. 2)
      f = v.grip * frontLoad;
    }
    expectClose(tractionLimit(v, load).force, f, 1e-9, { what: 'closed form against iteration' });
  });

  it('splits the drive of an all-wheel-drive car, passing more than either axle alone', () => {
    const all = tractionLimit(car({ drivenAxle: 'all', frontTorqueShare: 0.4 }), still).force;
    // By construction: both axles' grip is used.
    expect(all).toBeGreaterThan(tractionLimit(car(), still).force);
    expect(all).toBeGreaterThan(tractionLimit(car({ drivenAxle: 'rear', drivenAxleWeightShare: 0.4 }), still).force);
    // With 40 % of the torque on the front and 60 % of the weight there, the front saturates first (by hand):
    // 0.4·F = 1.2·(0.6·W − 0.2·F) ⇒ F = 0.72·W/0.64 = 16 548.72 N (the rear would pass 0.48·W/0.36 = 19 613.30 N).
    expectClose(all, 16548.72, 1e-5, { what: 'all-wheel-drive limit' });
  });

  it("says when the front lifts before a rear-drive car's tyres slip", () => {
    // μ·h/L = 2·0.6/1 ≥ 1: the rear gains load faster than it needs it; the front axle's load reaches 0
    // at F = s·W·L/h (moments about the rear contact, by hand: 0.5·14 709.975·1/0.6 = 12 258.31 N).
    const limit = tractionLimit(car({ drivenAxle: 'rear', drivenAxleWeightShare: 0.5, grip: 2, cgHeight: 0.6, wheelbase: 1 }), still);
    expect(limit.limitedBy).toBe('front-lifts');
    expectClose(limit.force, 12258.31, 1e-5, { what: 'front lifts' });
    expectClose(limit.frontLoad, 0, 1e-9, { absoluteBelow: 1, what: 'front load' });
  });
});
