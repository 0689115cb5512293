import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';
import { planVerdicts } from '#shared/matching/verdict';
import type { PointValues } from '#shared/matching/result';
import { studyDocumentSchema } from '#shared/schemas/study';
import { compareLines } from '#shared/study/compare';
import { runStudyDocument } from '#shared/study/run';
import { repoRoot } from '../maps/helpers';

// The demo studies with the built-in demo maps, as a new user first sees them. The checks are of
// the rules themselves (a limit crossed has its margin; an unreachable point has no results), so
// they hold whatever the invented demo numbers are.

const maps: Record<string, SpoolbookMap> = {};
for (const file of readdirSync(path.join(repoRoot, 'data/maps')).filter((f) => f.endsWith('.csv'))) {
  const parsed = parseMapFile(readFileSync(path.join(repoRoot, 'data/maps', file), 'utf8'));
  if (parsed.ok) maps[`builtin-${file.replace(/\.csv$/, '')}`] = parsed.map;
}
const demo = (file: string) => studyDocumentSchema.parse(JSON.parse(readFileSync(path.join(repoRoot, 'data/demo', file), 'utf8')));
const studies = ['hillclimb-study.json', 'turbine-housing-study.json'].map((f) => ({ file: f, result: runStudyDocument(demo(f), maps) }));
// The S44 plan with a wheel limit of its own under the map's 180 000 rpm (invented): on the hot day at
// 1,500 m its points just short of choke run over it, so an over-speed point on the map is among those checked.
const limited = demo('hillclimb-study.json');
limited.plans[0].maxShaftSpeed = 172_000;
const variants = [{ file: 'hillclimb-study.json, S44 limited to 172 000 rpm', result: runStudyDocument(limited, maps) }];
const allValues = [...studies, ...variants].flatMap((s) =>
  s.result.lines.flatMap((l) => l.points.flatMap((p) => (p.values ? [{ line: l, v: p.values }] : []))),
);

const RESULTS: (keyof PointValues)[] = [
  'compressorEfficiency',
  'compressorOutletTemperature',
  'compressorPower',
  'brakePower',
  'wheelPower',
  'torque',
  'fuelMassFlow',
  'injectorDuty',
  'turbinePower',
  'drivePressureRatio',
];

describe('the demo studies judged at the edge of the map', () => {
  it('has points in every kind of place, so the checks below bite', () => {
    const regions = new Set(allValues.map(({ v }) => v.mapRegion));
    for (const r of ['on-map', 'left-of-surge', 'past-choke', 'over-speed'] as const) expect(regions, r).toContain(r);
  });

  it('fills the matching margin, at or below 0, wherever a limit is crossed', () => {
    for (const { line, v } of allValues) {
      const where = `${line.planName} / ${line.scenarioName} / ${line.rowLabel} at ${v.rpm} rpm`;
      if (v.mapRegion === 'left-of-surge') expect(v.surgeMargin, where).not.toBeNull();
      if (v.mapRegion === 'left-of-surge') expect(v.surgeMargin!, where).toBeLessThanOrEqual(0);
      if (v.mapRegion === 'past-choke') expect(v.chokeMargin, where).not.toBeNull();
      if (v.mapRegion === 'past-choke') expect(v.chokeMargin!, where).toBeLessThanOrEqual(0);
      if (v.mapRegion === 'over-speed') expect(v.speedMargin!, where).toBeLessThan(0);
    }
  });

  it('says why wherever a margin is blank', () => {
    for (const { v } of allValues) {
      if (!v.mapRegion) continue;
      if (v.surgeMargin === null) expect(['above-surge-line', 'below-surge-line']).toContain(v.marginBasis!.surge);
      if (v.chokeMargin === null) expect(['below-choke-line', 'above-map']).toContain(v.marginBasis!.choke);
    }
  });

  it('gives no results at a point the compressor cannot deliver', () => {
    const unreachable = allValues.filter(({ v }) => v.reachable === false);
    expect(unreachable.length).toBeGreaterThan(10);
    for (const { v } of unreachable) for (const key of RESULTS) expect(v[key], `${key} at ${v.rpm} rpm`).toBeNull();
  });

  it('judges the S44 plan of the "which compressor?" study: does not fit, first reason past choke', () => {
    const [s44] = planVerdicts(studies[0].result);
    expect(s44.planName).toMatch(/S44/);
    expect(s44.status).toBe('does-not-fit');
    expect(s44.reasons[0].code).toBe('map-beyond-choke');
    expect(s44.headline).toMatch(/^Does not fit: past choke from [0-9,]+ rpm at “/);
  });

  it('takes Side by side peaks over reachable points only, and marks nothing best on a plan that does not fit', () => {
    const result = studies[0].result;
    const verdicts = planVerdicts(result);
    const lines = result.lines.filter((l) => l.scenarioIndex === 0).map((l) => ({ ...l, planVerdict: verdicts[l.planIndex].status }));
    const rows = compareLines(lines);
    const power = rows.find((r) => r.key === 'peakBrakePower')!;
    lines.forEach((line, i) => {
      const reachablePowers = line.points.flatMap((p) => (p.values?.reachable && p.values.brakePower !== null ? [p.values.brakePower] : []));
      expect(power.cells[i].value).toBe(reachablePowers.length ? Math.max(...reachablePowers) : null); // definition of the row
    });
    for (const r of rows) for (const i of r.bestIndices) expect(lines[i].planVerdict).not.toBe('does-not-fit');
  });
});
