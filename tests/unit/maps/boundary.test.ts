import { describe, expect, it } from 'vitest';
import { compressorModelFromMap, isentropicHead } from '#shared/maps';
import { isReachable, mapRegionOf } from '#shared/matching/compressor/reach';
import { compressorOf, parseOk } from './helpers';
import { expectClose } from '../expect-close';

// A small hand-made map; every expected value below is worked out by hand from these rows.
//   surge (0.05, 1.2) (0.08, 1.8) (0.10, 2.4)
//   choke (0.15, 1.1) (0.20, 1.6) (0.25, 2.2)   – its top is the top speed line's last point
//   speed 80000: (0.05, 1.2) (0.10, 1.18) (0.15, 1.1)
//   speed 120000: (0.08, 1.8) (0.14, 1.75) (0.20, 1.6)
//   speed 150000: (0.10, 2.4) (0.18, 2.35) (0.25, 2.2)       max speed 160000 rpm
const HAND = `# spoolbook-map: 1
# kind: compressor
# name: Hand-made edge map
# flow: corrected mass, kg/s
# reference temperature: 298 K
# reference pressure: 100 kPa
# efficiency: percent
# max speed: 160000 rpm
curve,label,flow,pressure_ratio,efficiency,speed
surge,,0.05,1.2,,
surge,,0.08,1.8,,
surge,,0.10,2.4,,
choke,,0.15,1.1,,
choke,,0.20,1.6,,
choke,,0.25,2.2,,
speed,80000,0.05,1.2,65,80000
speed,80000,0.10,1.18,72,80000
speed,80000,0.15,1.1,60,80000
speed,120000,0.08,1.8,68,120000
speed,120000,0.14,1.75,75,120000
speed,120000,0.20,1.6,62,120000
speed,150000,0.10,2.4,66,150000
speed,150000,0.18,2.35,73,150000
speed,150000,0.25,2.2,60,150000
`;

const model = compressorModelFromMap(compressorOf(parseOk(HAND)));
/** Isentropic head PR^((γ−1)/γ) − 1 with γ = 1.4 for air (isentropic relation). */
const head = (pr: number) => Math.pow(pr, 0.4 / 1.4) - 1;

describe('margins against the whole edge of a compressor map', () => {
  it('inside the map: both margins measured to their lines, speed read from the speed lines', () => {
    const r = model.read(0.14, 1.75); // a row of the 120000 rpm line
    expect(r.location).toBe('inside');
    // surge flow at PR 1.75: 0.05 + 0.03·(0.55/0.6) = 0.0775; (0.14 − 0.0775)/0.14 (by hand)
    expectClose(r.surgeMargin, (0.14 - 0.0775) / 0.14, 1e-12);
    expect(r.surgeMarginBasis).toBe('surge-line');
    // choke flow at PR 1.75: 0.20 + 0.05·(0.15/0.6) = 0.2125; (0.2125 − 0.14)/0.14 (by hand)
    expectClose(r.chokeMargin, (0.2125 - 0.14) / 0.14, 1e-12);
    expect(r.chokeMarginBasis).toBe('choke-line');
    expectClose(r.shaftSpeed, 120_000, 1e-12); // the row itself
    expect(r.speedBasis).toBe('speed-lines');
    expectClose(r.speedMargin, (160_000 - 120_000) / 160_000, 1e-12); // (Nmax − N)/Nmax
    expect(mapRegionOf(r.location, r.speedMargin)).toBe('on-map');
  });

  it('left of surge: a negative surge margin, and the speed taken along the surge line', () => {
    const r = model.read(0.03, 1.5);
    expect(r.location).toBe('left-of-surge');
    // surge flow at PR 1.5: 0.05 + 0.03·(0.3/0.6) = 0.065; (0.03 − 0.065)/0.03 (by hand)
    expectClose(r.surgeMargin, (0.03 - 0.065) / 0.03, 1e-12);
    expect(r.surgeMargin!).toBeLessThan(0);
    // choke flow at 1.5: 0.15 + 0.05·(0.4/0.5) = 0.19; (0.19 − 0.03)/0.03 (by hand)
    expectClose(r.chokeMargin, (0.19 - 0.03) / 0.03, 1e-12);
    // Speed at the surge edge: N² linear in head between the lines' first points (1.2, 80000) and (1.8, 120000).
    const share = (head(1.5) - head(1.2)) / (head(1.8) - head(1.2));
    expectClose(r.shaftSpeed, Math.sqrt(80_000 ** 2 + share * (120_000 ** 2 - 80_000 ** 2)), 1e-12); // worked in this test
    expect(r.speedBasis).toBe('surge-edge');
    expect(r.efficiency).toBeNull();
    expect(isReachable(mapRegionOf(r.location, r.speedMargin), true)).toBe(false); // surge is never assumed away (design)
  });

  it("past choke below the choke line's top: a negative choke margin to the choke line, no speed", () => {
    const r = model.read(0.3, 1.5);
    expect(r.location).toBe('beyond-choke');
    expectClose(r.chokeMargin, (0.19 - 0.3) / 0.3, 1e-12); // choke flow 0.19 at PR 1.5 (by hand, above)
    expect(r.chokeMarginBasis).toBe('choke-line');
    expect(r.shaftSpeed).toBeNull(); // the map gives no speed past its choke line
    expect(r.speedBasis).toBe('past-choke');
    expect(r.speedMargin).toBeNull();
    expect(mapRegionOf(r.location, r.speedMargin)).toBe('past-choke');
  });

  it("above the choke line's top: the choke margin is measured to the top speed line's choke side", () => {
    // PR 2.3 is above the choke line's top (2.2). The top line comes down through 2.3 on its segment
    // (0.18, 2.35)–(0.25, 2.2): flow 0.25 + (0.18 − 0.25)·(2.3 − 2.2)/(2.35 − 2.2) = 0.2033… (by hand).
    const edge = 0.25 + (0.18 - 0.25) * ((2.3 - 2.2) / (2.35 - 2.2));
    const inside = model.read(0.15, 2.3);
    expect(inside.location).toBe('inside'); // the top line is at PR 2.36875 at 0.15 kg/s (by hand)
    expectClose(inside.chokeMargin, (edge - 0.15) / 0.15, 1e-12);
    expect(inside.chokeMarginBasis).toBe('top-speed-line');

    const past = model.read(0.24, 2.3);
    expect(past.location).toBe('beyond-choke');
    expectClose(past.chokeMargin, (edge - 0.24) / 0.24, 1e-12); // negative: past the edge
    expect(past.chokeMargin!).toBeLessThan(0);
    // It is also above the top line there (2.35 − 0.15·(0.06/0.07) = 2.2214 at 0.24 kg/s, by hand):
    // the speed is extrapolated up from the top line by head ∝ N².
    const topAt = 2.35 + (0.24 - 0.18) * ((2.2 - 2.35) / (0.25 - 0.18));
    expectClose(past.shaftSpeed, 150_000 * Math.sqrt(head(2.3) / head(topAt)), 1e-12); // worked in this test
    expect(past.speedBasis).toBe('above-top-speed-line');
    expect(mapRegionOf(past.location, past.speedMargin)).toBe('past-choke'); // choke is named first
  });

  it('over the speed limit above the top line: a negative speed margin, never blank', () => {
    const r = model.read(0.15, 2.8);
    expect(r.location).toBe('above-top-speed');
    // The top line at 0.15 kg/s: 2.4 + (2.35 − 2.4)·(0.05/0.08) = 2.36875 (by hand); N = 150000·√(h(2.8)/h(2.36875)).
    const n = 150_000 * Math.sqrt(head(2.8) / head(2.36875));
    expectClose(r.shaftSpeed, n, 1e-12); // worked in this test, about 165 950 rpm
    expect(r.speedBasis).toBe('above-top-speed-line');
    expectClose(r.speedMargin, (160_000 - n) / 160_000, 1e-12);
    expect(r.speedMargin!).toBeLessThan(0);
    expect(mapRegionOf(r.location, r.speedMargin)).toBe('over-speed');
    // Above the surge line's top (2.4) and above the whole map: no surge or choke line at PR 2.8.
    expect(r.surgeMargin).toBeNull();
    expect(r.surgeMarginBasis).toBe('above-surge-line');
    expect(r.chokeMargin).toBeNull();
    expect(r.chokeMarginBasis).toBe('above-map');
  });

  it("above the top line but under the wheel's limit: above the map, not over speed", () => {
    const r = model.read(0.15, 2.6);
    const n = 150_000 * Math.sqrt(head(2.6) / head(2.36875)); // about 158 990 rpm, worked in this test
    expectClose(r.shaftSpeed, n, 1e-12);
    expect(r.speedMargin!).toBeGreaterThan(0);
    expect(mapRegionOf(r.location, r.speedMargin)).toBe('above-map');
    expect(isReachable('above-map', false)).toBe(false); // the map does not show it running there
    expect(isReachable('above-map', true)).toBe(true); // unless an off-map efficiency is assumed (design)
  });

  it('below the map: no margins where the lines do not reach, and reachable', () => {
    const r = model.read(0.12, 1.05);
    expect(r.location).toBe('below-map'); // the lowest line is at PR 1.148 at 0.12 kg/s (by hand)
    expect(r.surgeMargin).toBeNull();
    expect(r.surgeMarginBasis).toBe('below-surge-line'); // the surge line starts at PR 1.2
    expect(r.chokeMargin).toBeNull();
    expect(r.chokeMarginBasis).toBe('below-choke-line'); // the choke line starts at PR 1.1
    expect(r.shaftSpeed).toBeNull();
    expect(r.speedBasis).toBe('below-map');
    expect(mapRegionOf(r.location, r.speedMargin)).toBe('below-map');
    expect(isReachable('below-map', false)).toBe(true); // a light load the compressor meets turning slower (design)
  });

  it('computes the isentropic head as PR^((γ−1)/γ) − 1', () => {
    // PR 2: 2^(0.4/1.4) − 1 = 0.2190137: the isentropic ideal-gas relation T2s/T1 = PR^((γ−1)/γ) (Çengel & Boles, Thermodynamics, isentropic relations of ideal gases; worked by hand)
    expectClose(isentropicHead(2), 0.2190137, 1e-6);
  });
});

describe('the region of a point', () => {
  it('names the limit that matters first and judges the speed limit on the real speed', () => {
    expect(mapRegionOf(null, null)).toBeNull(); // no map
    expect(mapRegionOf('inside', -0.01)).toBe('over-speed'); // inside the lines but the wheel over its limit (hot day)
    expect(mapRegionOf('left-of-surge', -0.5)).toBe('left-of-surge');
    expect(mapRegionOf('beyond-choke', -0.5)).toBe('past-choke');
    expect(mapRegionOf('off-map', 0.2)).toBe('outside-speed-lines');
    expect(isReachable(null, false)).toBe(true); // nothing to judge against without a map
    expect(isReachable('over-speed', true)).toBe(false); // overspeed is never assumed away
    expect(isReachable('past-choke', true)).toBe(true);
  });
});
