import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { applyAffine, fitAffine, invertAffine } from '#shared/tracer/affine';
import { axisCoordinate, axisValue } from '#shared/tracer/axes';
import { calibrate, calibrateClicks, dataToPixel, pixelToData, type ReferenceClick, type ReferencePoint } from '#shared/tracer/calibration';
import { expectClose } from '../expect-close';
import { drawnAt, pictureTransform } from './helpers';

// Every picture below is made by hand from a chosen transform (helpers.ts), so the values a
// calibration must find are known exactly; tolerances are floating-point round-off (common
// practice, no source) unless a test says otherwise.

describe('axis scales', () => {
  it('a linear axis keeps the value; a log axis uses log10, and both invert exactly', () => {
    expect(axisCoordinate(2.5, 'linear')).toBe(2.5); // identity, by definition
    expect(axisCoordinate(1000, 'log')).toBe(3); // log10(1000) = 3, by definition
    expectClose(axisValue(axisCoordinate(0.0731, 'log')!, 'log'), 0.0731, 1e-15, { absoluteBelow: 1 });
  });

  it('refuses values that cannot be on the axis', () => {
    expect(axisCoordinate(0, 'log')).toBeNull();
    expect(axisCoordinate(-1, 'log')).toBeNull();
    expect(axisCoordinate(Number.NaN, 'linear')).toBeNull();
    expect(axisCoordinate(Number.POSITIVE_INFINITY, 'linear')).toBeNull();
  });
});

describe('pixel → data → pixel round trips', () => {
  // A flow axis 0..0.5 kg/s over 900 px and a pressure-ratio axis 1..4 over 600 px, upright.
  const upright = pictureTransform({ degrees: 0, pxPerX: 1800, pxPerY: 200, origin: { x: 80, y: 680 } });
  const references: ReferencePoint[] = [
    { value: { x: 0.1, y: 1 }, pixel: drawnAt(upright, { x: 0.1, y: 1 }) },
    { value: { x: 0.4, y: 1 }, pixel: drawnAt(upright, { x: 0.4, y: 1 }) },
    { value: { x: 0, y: 1.5 }, pixel: drawnAt(upright, { x: 0, y: 1.5 }) },
    { value: { x: 0, y: 3.5 }, pixel: drawnAt(upright, { x: 0, y: 3.5 }) },
  ];

  it('linear axes: any pixel comes back to itself, and data to themselves', () => {
    const result = calibrate(references, { x: 'linear', y: 'linear' });
    if (!result.ok) throw new Error(result.problems[0].message);
    fc.assert(
      fc.property(fc.double({ min: -200, max: 2000, noNaN: true }), fc.double({ min: -200, max: 2000, noNaN: true }), (px, py) => {
        const data = pixelToData(result.calibration, { x: px, y: py });
        const back = dataToPixel(result.calibration, data)!;
        expectClose(back.x, px, 1e-9, { absoluteBelow: 1 });
        expectClose(back.y, py, 1e-9, { absoluteBelow: 1 });
      }),
    );
    // The hand-made picture puts 0.25 kg/s at PR 2.2 at x = 80 + 1800·0.25, y = 680 − 200·2.2.
    const at = pixelToData(result.calibration, { x: 80 + 1800 * 0.25, y: 680 - 200 * 2.2 });
    expectClose(at.x, 0.25, 1e-12, { absoluteBelow: 1 });
    expectClose(at.y, 2.2, 1e-12, { absoluteBelow: 1 });
  });

  it('log axes: round trips are exact too, and decades are evenly spaced', () => {
    // Flow 0.01..1 on a log axis, 400 px a decade; pressure ratio on a log axis, 900 px a decade.
    const scales = { x: 'log', y: 'log' } as const;
    const picture = pictureTransform({ degrees: 0, pxPerX: 400, pxPerY: 900, origin: { x: 900, y: 700 } });
    const refs: ReferencePoint[] = [
      { value: { x: 0.02, y: 1 }, pixel: drawnAt(picture, { x: 0.02, y: 1 }, scales) },
      { value: { x: 0.5, y: 1 }, pixel: drawnAt(picture, { x: 0.5, y: 1 }, scales) },
      { value: { x: 0.01, y: 1.5 }, pixel: drawnAt(picture, { x: 0.01, y: 1.5 }, scales) },
      { value: { x: 0.01, y: 3 }, pixel: drawnAt(picture, { x: 0.01, y: 3 }, scales) },
    ];
    const result = calibrate(refs, scales);
    if (!result.ok) throw new Error(result.problems[0].message);
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 10, noNaN: true }), fc.double({ min: 1, max: 6, noNaN: true }), (flow, ratio) => {
        const pixel = dataToPixel(result.calibration, { x: flow, y: ratio })!;
        const data = pixelToData(result.calibration, pixel);
        expectClose(data.x, flow, 1e-9, { absoluteBelow: 1 });
        expectClose(data.y, ratio, 1e-9, { absoluteBelow: 1 });
        const again = dataToPixel(result.calibration, data)!;
        expectClose(again.x, pixel.x, 1e-9, { absoluteBelow: 1 });
        expectClose(again.y, pixel.y, 1e-9, { absoluteBelow: 1 });
      }),
    );
    // One decade of flow is 400 px wherever it starts (the picture was made so).
    const a = dataToPixel(result.calibration, { x: 0.03, y: 2 })!;
    const b = dataToPixel(result.calibration, { x: 0.3, y: 2 })!;
    expectClose(b.x - a.x, 400, 1e-9, { absoluteBelow: 1 });
    expect(dataToPixel(result.calibration, { x: 0, y: 2 })).toBeNull();
  });
});

describe('the least-squares affine fit', () => {
  it('recovers a known rotation and scale with a residual near zero', () => {
    // A scan fed 2.5° askew, 1650 px per kg/s and 210 px per unit of pressure ratio.
    const picture = pictureTransform({ degrees: 2.5, pxPerX: 1650, pxPerY: 210, origin: { x: 95.5, y: 702.25 } });
    const values = [
      { x: 0.05, y: 1 },
      { x: 0.45, y: 1 },
      { x: 0, y: 1.5 },
      { x: 0, y: 3.5 },
      { x: 0.3, y: 2.5 },
    ];
    const result = fitAffine(values.map((v) => ({ from: v, to: drawnAt(picture, v) })));
    if (!result.ok) throw new Error(result.reason);
    const t = result.fit.transform;
    for (const key of ['a', 'b', 'c', 'd', 'e', 'f'] as const) expectClose(t[key], picture[key], 1e-9, { absoluteBelow: 1 });
    // The angle and scales themselves, read back from the fitted matrix.
    expectClose((Math.atan2(t.c, t.a) * 180) / Math.PI, 2.5, 1e-9, { absoluteBelow: 1 });
    expectClose(Math.hypot(t.a, t.c), 1650, 1e-9, { absoluteBelow: 1 });
    expectClose(Math.hypot(t.b, t.d), 210, 1e-9, { absoluteBelow: 1 });
    expect(result.fit.rmsResidual).toBeLessThan(1e-9); // pixels; exact data, so round-off only
    expect(result.fit.degreesOfFreedom).toBe(4); // 2·5 equations − 6 unknowns
  });

  it('a deliberately wrong click raises the residual, most on the axis it was on', () => {
    const picture = pictureTransform({ degrees: -1.2, pxPerX: 1500, pxPerY: 240, origin: { x: 60, y: 650 } });
    // Two clicks on each axis and one at the corner where they cross, as the Tracer asks.
    const values = [
      { x: 0.1, y: 1 },
      { x: 0.4, y: 1 },
      { x: 0, y: 1.5 },
      { x: 0, y: 3 },
      { x: 0, y: 1 },
    ];
    const pairs = values.map((v) => ({ from: v, to: drawnAt(picture, v) }));
    const good = fitAffine(pairs);
    if (!good.ok) throw new Error(good.reason);
    expect(good.fit.rmsResidual).toBeLessThan(1e-9);
    // The user clicked 12 px to the right of where 0.4 kg/s is on the axis.
    const wrong = pairs.map((p, i) => (i === 1 ? { ...p, to: { x: p.to.x + 12, y: p.to.y } } : p));
    const bad = fitAffine(wrong);
    if (!bad.ok) throw new Error(bad.reason);
    // Six free coefficients absorb much of any one error; what is left is still far above
    // round-off: over 1 px RMS for a 12 px slip (this layout leaves about 1.1 px RMS and 2.1 px
    // at the worst click). Half-pixel clicking leaves well under 1 px.
    expect(bad.fit.rmsResidual).toBeGreaterThan(1);
    expect(bad.fit.maxResidual).toBeLessThan(12);
    // A slip along the horizontal axis shows on that axis's two clicks first.
    expect([0, 1]).toContain(bad.fit.residuals.indexOf(bad.fit.maxResidual));
  });

  it('three points fit exactly whatever they are: no check is possible yet', () => {
    const result = fitAffine([
      { from: { x: 0, y: 0 }, to: { x: 10, y: 500 } },
      { from: { x: 1, y: 0 }, to: { x: 913, y: 488 } },
      { from: { x: 0, y: 1 }, to: { x: 17, y: 20 } },
    ]);
    if (!result.ok) throw new Error(result.reason);
    expect(result.fit.degreesOfFreedom).toBe(0);
    expect(result.fit.rmsResidual).toBeLessThan(1e-9);
  });

  it('refuses too few points and points on one line', () => {
    expect(fitAffine([{ from: { x: 0, y: 0 }, to: { x: 0, y: 0 } }])).toEqual({ ok: false, reason: 'too-few' });
    const collinear = [0, 1, 2, 3].map((i) => ({ from: { x: i, y: 2 * i }, to: { x: 10 * i, y: 5 * i } }));
    expect(fitAffine(collinear)).toEqual({ ok: false, reason: 'collinear' });
  });

  it('inverts exactly and refuses a transform that squeezes the plane to a line', () => {
    const t = { a: 2, b: 0.5, c: -0.25, d: 3, e: 7, f: -4 };
    const inverse = invertAffine(t)!;
    const p = applyAffine(inverse, applyAffine(t, { x: 1.25, y: -3.5 }));
    expectClose(p.x, 1.25, 1e-14, { absoluteBelow: 1 });
    expectClose(p.y, -3.5, 1e-14, { absoluteBelow: 1 });
    expect(invertAffine({ a: 1, b: 2, c: 2, d: 4, e: 0, f: 0 })).toBeNull();
  });
});

describe('calibrating from the clicks the Tracer asks for', () => {
  const picture = pictureTransform({ degrees: 1.5, pxPerX: 2000, pxPerY: 180, origin: { x: 70, y: 720 } });
  const clickAt = (role: ReferenceClick['role'], x: number | null, y: number | null, at: { x: number; y: number }): ReferenceClick => ({
    role,
    pixel: drawnAt(picture, at),
    x,
    y,
  });
  // Two clicks on each axis; the axes cross at flow 0 and pressure ratio 1 (the picture's corner).
  const clicks = [
    clickAt('x-axis', 0.1, null, { x: 0.1, y: 1 }),
    clickAt('x-axis', 0.3, null, { x: 0.3, y: 1 }),
    clickAt('y-axis', null, 2, { x: 0, y: 2 }),
    clickAt('y-axis', null, 3.5, { x: 0, y: 3.5 }),
  ];

  it('two clicks on each axis and the crossing values calibrate a rotated scan', () => {
    const { result, residualsByClick } = calibrateClicks(clicks, { x: 0, y: 1 }, { x: 'linear', y: 'linear' });
    if (!result.ok) throw new Error(result.problems[0].message);
    for (const r of residualsByClick) expect(r!).toBeLessThan(1e-9);
    const data = pixelToData(result.calibration, drawnAt(picture, { x: 0.2, y: 2.7 }));
    expectClose(data.x, 0.2, 1e-12, { absoluteBelow: 1 });
    expectClose(data.y, 2.7, 1e-12, { absoluteBelow: 1 });
  });

  it('a click off its axis shows in the residual', () => {
    // The second vertical-axis click landed 8 px right of the axis line.
    const off = clicks.map((c, i) => (i === 3 ? { ...c, pixel: { x: c.pixel!.x + 8, y: c.pixel!.y } } : c));
    const { result, residualsByClick } = calibrateClicks(off, { x: 0, y: 1 }, { x: 'linear', y: 'linear' });
    if (!result.ok) throw new Error(result.problems[0].message);
    expect(result.calibration.maxResidual).toBeGreaterThan(1); // pixels; far above round-off
    expect(residualsByClick.every((r) => r !== null)).toBe(true);
  });

  it('says what is missing: crossing values, typed values, enough clicks', () => {
    const missingCrossing = calibrateClicks(clicks, { x: null, y: 1 }, { x: 'linear', y: 'linear' });
    expect(missingCrossing.result.ok).toBe(false);
    if (!missingCrossing.result.ok) {
      expect(missingCrossing.result.problems).toHaveLength(1); // one problem, though two clicks need the value
      expect(missingCrossing.result.problems[0].message).toMatch(/where the axes cross/);
    }
    const untyped = calibrateClicks([{ ...clicks[0], x: null }, ...clicks.slice(1)], { x: 0, y: 1 }, { x: 'linear', y: 'linear' });
    if (untyped.result.ok) throw new Error('should refuse');
    expect(untyped.result.problems[0].index).toBe(0);
    const two = calibrateClicks(clicks.slice(0, 2), { x: 0, y: 1 }, { x: 'linear', y: 'linear' });
    if (two.result.ok) throw new Error('should refuse');
    expect(two.result.problems[0].message).toMatch(/at least 3/);
    const logZero = calibrateClicks(clicks, { x: 0, y: 1 }, { x: 'log', y: 'linear' });
    if (logZero.result.ok) throw new Error('should refuse');
    expect(logZero.result.problems[0].message).toMatch(/above zero/);
  });

  it('clicks all on one line in the picture are refused in words', () => {
    const line = [
      { role: 'point' as const, pixel: { x: 0, y: 0 }, x: 0, y: 1 },
      { role: 'point' as const, pixel: { x: 10, y: 10 }, x: 1, y: 1 },
      { role: 'point' as const, pixel: { x: 20, y: 20 }, x: 0, y: 2 },
    ];
    const { result } = calibrateClicks(line, { x: null, y: null }, { x: 'linear', y: 'linear' });
    if (result.ok) throw new Error('should refuse');
    expect(result.problems[0].message).toMatch(/one line in the picture/);
  });
});
