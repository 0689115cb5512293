import { describe, expect, it } from 'vitest';
import { integrateSpool, type SpoolPhysics } from '#shared/drive/spool-integrate';
import { expectClose } from '../expect-close';

/** A rotor whose boost follows ω² (c Pa per (rad/s)²), driven by a constant surplus power, engine speed held. */
function constantSurplus(power: number, c: number, target: number): SpoolPhysics {
  return {
    target: () => target,
    boostAt: (_rpm, omega) => c * omega * omega,
    shaftSpeedAt: (_rpm, boost) => Math.sqrt(Math.max(0, boost) / c),
    state: () => ({ surplus: power, acceleration: 0 }),
    engineSpeedAt: () => 3000,
    roadSpeedAt: () => 10,
  };
}

describe('the time-to-boost integration', () => {
  it('matches the closed form of a constant surplus power', () => {
    // I·ω·dω/dt = P, from rest: ½·I·ω² = P·t, so t = ½·I·ω²/P (closed form). With boost = c·ω², 90 % of
    // 100 kPa is ω² = 9·10⁷ (rad/s)²: t = 0.5·1e-4·9e7/1000 = 4.5 s (by hand).
    const run = integrateSpool(constantSurplus(1000, 1e-3, 100_000), { inertia: 1e-4, startRpm: 3000, stopRpm: 7000 });
    expectClose(run.timeTo90, 4.5, 1e-9, { what: 'time to 90 %' });
    expect(run.why).toBeNull();
    // Boost at each sample is c·2·P·t/I (same closed form).
    for (const s of run.samples) expectClose(s.boost, (1e-3 * 2 * 1000 * s.time) / 1e-4, 1e-9, { what: `boost at ${s.time} s`, absoluteBelow: 1 });
  });

  it('says why when the target is not reached in time or the engine reaches the shift speed first', () => {
    const slow = integrateSpool(constantSurplus(10, 1e-3, 100_000), { inertia: 1e-4, startRpm: 3000, stopRpm: 7000, maxTime: 2 });
    expect(slow.timeTo90).toBeNull();
    expect(slow.why).toMatch(/^boost reaches only \d+ kPa within 2 s/);
    const shifting = integrateSpool(
      { ...constantSurplus(10, 1e-3, 100_000), engineSpeedAt: (v) => v * 300, roadSpeedAt: (n) => n / 300, state: () => ({ surplus: 10, acceleration: 5 }) },
      { inertia: 1e-4, startRpm: 3000, stopRpm: 4000 },
    );
    expect(shifting.timeTo90).toBeNull();
    expect(shifting.why).toMatch(/shift speed \(4000 rpm\)/);
  });
});
