import { describe, expect, it } from 'vitest';
import { largestTriangleThreeBuckets } from '#shared/logs/downsample';
import { packChannels, unpackChannels } from '#shared/logs/pack';
import { detectSegments } from '#shared/logs/segments';

describe('stored channels', () => {
  it('come back to the resolution of their quantity, missing samples kept', () => {
    const channels = {
      time: Float64Array.from([0, 0.01, 0.02, 1000.5]),
      engineSpeed: Float64Array.from([3000.4, 3001, 2999, 7000]),
      manifoldPressure: Float64Array.from([101_325, 150_000.6, Number.NaN, 250_000]),
    };
    const back = unpackChannels(packChannels(channels, 4));
    expect(back.rowCount).toBe(4);
    // Resolutions of shared/logs/quantities.ts (common practice, no source): 0.1 ms, 1 rpm, 1 Pa.
    expect(Array.from(back.channels.engineSpeed!)).toEqual([3000, 3001, 2999, 7000]);
    expect(Array.from(back.channels.manifoldPressure!)).toEqual([101_325, 150_001, Number.NaN, 250_000]);
    expect(back.channels.time![3]).toBeCloseTo(1000.5, 6);
  });

  it('refuses bytes that are not a stored log', () => {
    expect(() => unpackChannels(new Uint8Array([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]))).toThrow(/not a stored log/);
  });
});

describe('segments', () => {
  it('finds a full-throttle pull and a steady hold', () => {
    // Invented log (common practice, no source, for "wide open is above 90 %"): 5 s hold at 2000 rpm part throttle, then 4 s at full throttle from 2000 to 6000 rpm.
    const time = Float64Array.from({ length: 91 }, (_, i) => i * 0.1);
    const rpm = Float64Array.from(time, (t) => (t < 5 ? 2000 : 2000 + (t - 5) * 1000));
    const throttle = Float64Array.from(time, (t) => (t < 5 ? 0.3 : 1));
    const segments = detectSegments({ time, engineSpeed: rpm, manifoldPressure: new Float64Array(91).fill(1e5), throttle });
    expect(segments.map((s) => s.kind)).toEqual(['hold', 'pull']);
    expect(segments[1].rpmFrom).toBe(2000);
    expect(segments[1].rpmTo).toBeCloseTo(6000, 6);
  });
});

describe('largest-triangle-three-buckets', () => {
  it('keeps the ends and a peak', () => {
    // Steinarsson 2013: first and last points always kept; the spike at 50 spans the largest triangle of its bucket.
    const x = Array.from({ length: 101 }, (_, i) => i);
    const y = x.map((i) => (i === 50 ? 100 : 0));
    const kept = largestTriangleThreeBuckets(x, y, 12);
    expect(kept.length).toBe(12);
    expect(kept[0]).toBe(0);
    expect(kept[11]).toBe(100);
    expect(kept).toContain(50);
  });
});
