import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { mapValueFromSI, parseMapFile } from '#shared/maps';
import type { CompressorMap, TurbineMap } from '#shared/maps/types';
import { buildTrace, traceFileName, tracedNumber } from '#shared/tracer/build';
import { newTraceState, traceStateSchema, type TraceCurve, type TraceState } from '#shared/tracer/state';
import { expectClose } from '../expect-close';
import { drawnAt, pictureTransform } from './helpers';

// The fixture maps are read, drawn into a hand-made picture (helpers.ts), traced by "clicking" at
// the drawn pixels, and built back into a file: the file must read back to the same map, up to
// the five significant digits a traced value is written with (common practice, no source).

const fixtures = path.resolve(import.meta.dirname, '..', '..', 'fixtures', 'maps', 'good');
const minimal = parseMapFile(readFileSync(path.join(fixtures, 'compressor-minimal.csv'), 'utf8'));
if (!minimal.ok || minimal.map.kind !== 'compressor') throw new Error('fixture should read');
const fixture = minimal.map as CompressorMap;

// Flow in kg/s across, pressure ratio up, a scan 1.8° askew.
const picture = pictureTransform({ degrees: 1.8, pxPerX: 3000, pxPerY: 250, origin: { x: 90, y: 760 } });
const at = (flow: number, ratio: number) => drawnAt(picture, { x: flow, y: ratio });

function tracedCompressor(): TraceState {
  const state = newTraceState('Fixture compressor, traced');
  state.compressor.referenceTemperature = { value: 298, unit: 'K' };
  state.compressor.referencePressure = { value: 100, unit: 'kPa' };
  state.compressor.maxSpeed = 150000;
  state.calibration.clicks = [
    { id: 'x1', role: 'x-axis', pixel: at(0.05, 1), x: 0.05, y: null },
    { id: 'x2', role: 'x-axis', pixel: at(0.25, 1), x: 0.25, y: null },
    { id: 'y1', role: 'y-axis', pixel: at(0, 1.5), x: null, y: 1.5 },
    { id: 'y2', role: 'y-axis', pixel: at(0, 2.5), x: null, y: 2.5 },
    { id: 'corner', role: 'crossing', pixel: at(0, 1), x: null, y: null },
  ];
  state.curves = fixture.curves.map((curve, i): TraceCurve => {
    // Islands are clicked round without repeating the first point: the Tracer closes them.
    // Lines are clicked from choke towards surge: the Tracer orders them as the format wants.
    const clicked = curve.kind === 'island' ? curve.points.slice(0, -1) : [...curve.points].reverse();
    return {
      id: `c${i}`,
      kind: curve.kind,
      speed: curve.kind === 'speed' ? curve.points[0].speed : null,
      efficiency: curve.kind === 'island' ? curve.points[0].efficiency! * 100 : null,
      points: clicked.map((p) => at(p.correctedMassFlow, p.pressureRatio)),
    };
  });
  return state;
}

describe('a traced compressor map becomes a map file', () => {
  it('reads back as the map that was drawn', () => {
    const state = tracedCompressor();
    expect(traceStateSchema.safeParse(state).success).toBe(true);
    const build = buildTrace(state);
    expect(build.problems).toEqual([]);
    if (!build.result.ok || build.result.map.kind !== 'compressor') throw new Error('should build');
    const map = build.result.map;
    expect(build.result.notes).toEqual([]); // islands were closed by the Tracer, not by the reader
    expect(map.name).toBe('Fixture compressor, traced');
    expect(map.reference).toEqual(fixture.reference);
    expect(map.maxSpeed).toBe(150000);
    expect(map.curves.map((c) => [c.kind, c.label])).toEqual(fixture.curves.map((c) => [c.kind, c.label]));
    map.curves.forEach((curve, i) => {
      const want = fixture.curves[i];
      expect(curve.points).toHaveLength(want.points.length);
      curve.points.forEach((p, j) => {
        expectClose(p.correctedMassFlow, want.points[j].correctedMassFlow, 1e-5, { absoluteBelow: 1 }); // 5 significant digits
        expectClose(p.pressureRatio, want.points[j].pressureRatio, 1e-5, { absoluteBelow: 1 });
        if (curve.kind === 'speed') expect(p.speed).toBe(want.points[j].speed);
        if (curve.kind === 'island') expectClose(p.efficiency!, want.points[j].efficiency!, 1e-12, { absoluteBelow: 1 });
      });
    });
    expect(build.text).toContain('# note: Traced in the Spoolbook Tracer from a picture, calibrated from 5 reference points');
  });

  it('writes traced values to five significant digits', () => {
    expect(tracedNumber(0.0812345678)).toBe(0.081235); // rounding half up at the sixth digit
    expect(tracedNumber(2.3456789)).toBe(2.3457);
    expect(traceFileName('M58 / as traced')).toBe('M58-as-traced.csv');
    expect(traceFileName('  ')).toBe('traced-map.csv');
  });

  it('a second island of the same efficiency gets its own label', () => {
    const state = tracedCompressor();
    const island = state.curves.find((c) => c.kind === 'island')!;
    state.curves.push({ ...island, id: 'again', points: island.points.map((p) => ({ x: p.x + 40, y: p.y + 5 })) });
    const build = buildTrace(state);
    expect(build.problems).toEqual([]);
    if (!build.result.ok || build.result.map.kind !== 'compressor') throw new Error('should build');
    expect(build.result.map.curves.filter((c) => c.kind === 'island').map((c) => c.label)).toEqual(['74', '74 (2)']);
  });
});

describe('problems are placed where the user fixes them', () => {
  it('before calibration: the axes step says what is missing, and nothing else is blamed on the lines', () => {
    const state = tracedCompressor();
    state.calibration.clicks = state.calibration.clicks.map((c) => ({ ...c, pixel: null }));
    const build = buildTrace(state);
    expect(build.lines).toEqual([]);
    expect(build.problems.some((p) => p.area === 'axes' && /at least 3 reference points/.test(p.message))).toBe(true);
    expect(build.problems.some((p) => /no data rows|Nothing traced/i.test(p.message))).toBe(false);
  });

  it('settings are checked from the start, before anything is calibrated or traced', () => {
    const fresh = newTraceState('');
    const build = buildTrace(fresh);
    // A new trace has no name and no reference conditions (newTraceState leaves them to the user).
    expect(
      build.problems
        .filter((p) => p.area === 'map')
        .map((p) => p.field)
        .sort(),
    ).toEqual(['name', 'referencePressure', 'referenceTemperature']);
    fresh.name = 'Named';
    fresh.compressor.referenceTemperature.value = 298;
    fresh.compressor.referencePressure.value = 100;
    expect(buildTrace(fresh).problems.filter((p) => p.area === 'map')).toEqual([]);
  });

  it('settings: an empty name and missing reference conditions name their fields', () => {
    const state = tracedCompressor();
    state.name = '';
    state.compressor.referencePressure.value = null;
    const build = buildTrace(state);
    expect(build.result.ok).toBe(false);
    expect(build.problems.find((p) => p.field === 'name')?.message).toMatch(/^Name: the name is empty/);
    expect(build.problems.find((p) => p.field === 'referencePressure')?.message).toMatch(/^Reference pressure: type it/);
  });

  it('lines: a speed line without its speed, a line with one point, a line with none', () => {
    const state = tracedCompressor();
    const speed = state.curves.find((c) => c.kind === 'speed')!;
    speed.speed = null;
    const choke = state.curves.find((c) => c.kind === 'choke')!;
    choke.points = choke.points.slice(0, 1);
    state.curves.push({ id: 'empty', kind: 'speed', speed: 200000, efficiency: null, points: [] });
    const build = buildTrace(state);
    const about = (id: string) => build.problems.filter((p) => p.curveId === id);
    // One message per line and kind of problem, not one per row.
    expect(about(speed.id)).toHaveLength(1);
    expect(about(speed.id)[0].message).toMatch(/^Speed line \(speed not typed yet\), point 1 along the line: /);
    expect(about(choke.id)[0].message).toMatch(/^Choke limit: .*at least 2/);
    expect(about('empty')[0].message).toMatch(/has no points yet/);
  });

  it('a speed line traced back on itself is refused as the upload would refuse it', () => {
    const state = tracedCompressor();
    const speed = state.curves.find((c) => c.kind === 'speed')!;
    // A second click at 0.10 kg/s (the line already has one there): sorting cannot make the flow rise.
    speed.points = [...speed.points, at(0.1, 1.3)];
    const build = buildTrace(state);
    const problem = build.problems.find((p) => p.curveId === speed.id);
    expect(problem?.message).toMatch(/flow/);
    expect(build.result.ok).toBe(false);
  });
});

describe('a traced turbine map', () => {
  const turbine = parseMapFile(readFileSync(path.join(fixtures, 'turbine-divided.csv'), 'utf8'));
  if (!turbine.ok || turbine.map.kind !== 'turbine') throw new Error('fixture should read');
  const map = turbine.map as TurbineMap;

  it('with the flow parameter across and expansion ratio up, still writes expansion ratio first', () => {
    // Flow parameter in the file's own unit across (log axis), expansion ratio up (linear).
    const unit = map.fileUnits.flowParameterUnit;
    const fileFlow = (si: number) => mapValueFromSI(si, unit, 'flowParameter');
    const scales = { x: 'log', y: 'linear' } as const;
    const pic = pictureTransform({ degrees: -0.7, pxPerX: 600, pxPerY: 300, origin: { x: 700, y: 800 } });
    const state = newTraceState('Turbine, traced');
    state.kind = 'turbine';
    state.scales = scales;
    state.efficiency = map.fileUnits.efficiency;
    state.speedUnit = map.fileUnits.speedUnit as 'rpm' | 'krpm';
    state.turbine = {
      flowParameterUnit: unit,
      flowParameterAxis: 'x',
      housing: map.housing,
      scrollFeed: map.scrollFeed ?? 'both',
      areaRatio: map.areaRatio,
      efficiencyKind: 'with-bearing-losses',
    };
    const place = (fp: number, er: number) => drawnAt(pic, { x: fp, y: er }, scales);
    // The vertical axis stands at 0.005 (a log axis has no zero), the horizontal one at ER 1.
    state.calibration.crossing = { x: 0.005, y: 1 };
    state.calibration.clicks = [
      { id: 'x1', role: 'x-axis', pixel: place(0.01, 1), x: 0.01, y: null },
      { id: 'x2', role: 'x-axis', pixel: place(0.05, 1), x: 0.05, y: null },
      { id: 'y1', role: 'y-axis', pixel: place(0.005, 1.5), x: null, y: 1.5 },
      { id: 'y2', role: 'y-axis', pixel: place(0.005, 3), x: null, y: 3 },
    ];
    state.curves = map.curves.map((c, i) => ({
      id: `t${i}`,
      kind: 'flow',
      speed: c.points[0].speed,
      efficiency: null,
      points: c.points.map((p) => place(fileFlow(p.flowParameter), p.expansionRatio)),
    }));
    const build = buildTrace(state);
    expect(build.problems).toEqual([]);
    if (!build.result.ok || build.result.map.kind !== 'turbine') throw new Error('should build');
    const traced = build.result.map;
    expect(traced.housing).toBe(map.housing);
    expect(traced.scrollFeed).toBe(map.scrollFeed);
    // What the map's efficiency counts, as the tracer was told (docs/map-format.md's words).
    expect(build.text).toContain('# efficiency kind: total-to-static, with bearing losses\n');
    expect(traced.efficiencyKind).toBe('with-bearing-losses');
    traced.curves.forEach((curve, i) =>
      curve.points.forEach((p, j) => {
        expectClose(p.expansionRatio, map.curves[i].points[j].expansionRatio, 1e-5, { absoluteBelow: 1 });
        expectClose(p.flowParameter / map.curves[i].points[j].flowParameter, 1, 1e-5, { absoluteBelow: 1 });
      }),
    );
  });
});
