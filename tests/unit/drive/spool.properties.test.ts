import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { planSpools, rotorInertiaFromWheel } from '#shared/drive/spool';
import { expectClose } from '../expect-close';
import { computed, demoDriveDocument } from './helpers';

describe('time to boost of the demo turbine housing study', () => {
  const base = demoDriveDocument('turbineHousing');
  const { result, models } = computed(base);
  const spools = (inertia: number) =>
    planSpools({ ...base, vehicle: { ...base.vehicle!, rotors: base.plans.map((p) => ({ planId: p.id, rotorInertia: inertia })) } }, result, models);

  it('reaches 90 % of the target for both plans with the demo car', () => {
    for (const s of planSpools(base, result, models)) {
      expect(s.why).toBeNull();
      expect(s.timeTo90).toBeGreaterThan(0);
      expect(s.inertiaFrom).toBe('wheel-size');
    }
  });

  it('never spools faster with more rotor inertia', () => {
    fc.assert(
      // Rotors from 5·10⁻⁵ kg·m² up: lighter ones pass the demo map's surge line on the way up (next test).
      fc.property(fc.double({ min: 5e-5, max: 2e-4, noNaN: true }), fc.double({ min: 1.01, max: 4, noNaN: true }), (inertia, factor) => {
        const light = spools(inertia);
        const heavy = spools(inertia * factor);
        light.forEach((l, i) => {
          expect(l.timeTo90).not.toBeNull();
          expect(heavy[i].timeTo90).toBeGreaterThanOrEqual(l.timeTo90!);
        });
      }),
      { numRuns: 12 },
    );
  });

  it("stops, saying why, where the way up crosses the compressor map's surge line", () => {
    // A very light rotor raises boost before the engine's flow has grown: at 4500 rpm the demo map's surge line lies right of the line.
    const [s] = spools(1e-5);
    expect(s.timeTo90).toBeNull();
    expect(s.why).toMatch(/^at \d+ rpm and \d+ kPa the compressor point is left of surge: not reachable/);
  });

  it('says why a plan without an exhaust side has no time to boost', () => {
    const doc = demoDriveDocument('compressor');
    const [s] = planSpools(doc, computed(doc).result, computed(doc).models);
    expect(s.timeTo90).toBeNull();
    expect(s.why).toMatch(/no exhaust side/);
  });

  it('estimates the inertia from the wheel size by the fifth power', () => {
    // Similar wheels: I ∝ d⁵ (geometric similarity); the 55 mm reference figure is common practice, no source.
    expectClose(rotorInertiaFromWheel(0.055), 3e-5, 1e-12, { what: 'reference wheel' });
    expectClose(rotorInertiaFromWheel(0.11), 3e-5 * 32, 1e-12, { what: 'twice the diameter' });
  });
});
