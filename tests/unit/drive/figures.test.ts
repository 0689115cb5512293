import { describe, expect, it } from 'vitest';
import { driveFigures, roadSpeedAt, rowForGear, usableBoostOf, wheelForceOf } from '#shared/drive/figures';
import { expectClose } from '../expect-close';
import { computed, demoDriveDocument } from './helpers';

describe('road speed, wheel force and usable boost', () => {
  it('turns engine speed into road speed and torque into wheel force', () => {
    // v = 2π·N/60·r/i (definition): 6000 rpm, overall ratio 4.2, 0.3 m → 628.32·0.3/4.2 = 44.880 m/s (by hand).
    expectClose(roadSpeedAt(6000, 4.2, 0.3), 44.87989505, 1e-9, { what: 'road speed' });
    // F = T·i·(1 − loss)/r (definition): 300 N·m · 10 · 0.85 / 0.3 = 8500 N.
    expectClose(wheelForceOf(300, 10, 0.15, 0.3), 8500, 1e-12, { what: 'wheel force' });
  });

  it('keeps the target where the tyres cope, and lowers boost in proportion to manifold pressure where they do not', () => {
    // Within the limit: the target stands.
    expect(usableBoostOf(7000, 8000, 100_000, 100_000, 100_000)).toEqual({ usable: 100_000, beyondGrip: false });
    // Torque taken to follow manifold pressure (module note): (100 + 100 kPa)·8000/10 000 − 100 kPa = 60 kPa (by hand).
    expectClose(usableBoostOf(10_000, 8000, 100_000, 100_000, 100_000).usable, 60_000, 1e-12, { what: 'usable boost' });
    // Beyond grip even at no boost: 200·3000/10 000 − 100 = −40 kPa, so 0 and said.
    expect(usableBoostOf(10_000, 3000, 100_000, 100_000, 100_000)).toEqual({ usable: 0, beyondGrip: true });
  });

  it('runs each gear on the gear row at or below it, else the full-load row', () => {
    const rows = [{ kind: 'full-load' }, { kind: 'gear', gear: 1 }, { kind: 'gear', gear: 3 }, { kind: 'part-throttle' }];
    expect([1, 2, 3, 4].map((g) => rowForGear(rows, g))).toEqual([1, 1, 2, 2]);
    expect(rowForGear([{ kind: 'part-throttle' }, { kind: 'full-load' }], 1)).toBe(1);
  });
});

describe('drive figures of the demo study', () => {
  const doc = demoDriveDocument('compressor');
  const figures = driveFigures(doc, computed(doc).result)!;

  it('gives one gear per plan and gear ratio, and no force where the compressor cannot deliver the point', () => {
    expect(figures.gears.length).toBe(3 * 4); // 3 plans, 4 gears in the demo car
    const unreachable = figures.gears.flatMap((g) => g.points).filter((p) => p.wheelForce === null);
    expect(unreachable.length).toBeGreaterThan(0);
    for (const p of unreachable) {
      expect(p.why).toMatch(/^not reachable: the compressor point is (left of surge|past choke|over the speed limit|above the map|outside the speed lines)/);
      expect(p.usableBoost).toBeNull();
    }
  });

  it('limits a front-drive car in first gear, and a rear-drive car with the same static load on its driven axle less so', () => {
    const first = (f: NonNullable<typeof figures>) => f.gears.filter((g) => g.gear === 1).flatMap((g) => g.points.filter((p) => p.wheelForce !== null));
    const front = first(figures);
    // By construction: the demo engine's torque through first gear is far beyond grip at every reachable point.
    for (const p of front) expect(p.usableBoost!).toBeLessThan(p.boostTarget!);
    const rearDoc = demoDriveDocument('compressor', { drivenAxle: 'rear' });
    const rear = first(driveFigures(rearDoc, computed(rearDoc).result)!);
    expect(rear.length).toBe(front.length);
    rear.forEach((p, i) => {
      expect(p.tractionLimit).toBeGreaterThan(front[i].tractionLimit);
      expect(p.usableBoost!).toBeGreaterThanOrEqual(front[i].usableBoost!);
    });
    expect(rear.some((p, i) => p.usableBoost! > front[i].usableBoost!)).toBe(true);
  });

  it('keeps the whole target in top gear, where the tyres pass all the engine gives', () => {
    // By construction of the demo car: 4th gear's force stays below grip at every reachable point.
    const top = figures.gears.filter((g) => g.gear === 4).flatMap((g) => g.points.filter((p) => p.wheelForce !== null));
    for (const p of top) expect(p.usableBoost).toBe(p.boostTarget);
  });
});
