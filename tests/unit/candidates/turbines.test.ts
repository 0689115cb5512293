import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { candidateCsvRows, rankTurbines, sortTurbineCandidates, templatePlan, type TurbineCandidate } from '#shared/candidates';
import { studyDocumentSchema } from '#shared/schemas/study';
import { demoCompressor, demoTurbine, repoRoot, scaledTurbine } from '../maps/helpers';

// The invented turbine-housing demo study, its M58 compressor, and one invented turbine housing at
// three sizes: by construction a smaller housing builds exhaust pressure sooner (earlier boost,
// higher drive pressure ratio).
const doc = studyDocumentSchema.parse(JSON.parse(readFileSync(path.join(repoRoot, 'data/demo/turbine-housing-study.json'), 'utf8')));
const base = demoTurbine('ar064-single');
const housings = [
  { id: 'small', map: scaledTurbine(base, 0.8, { name: 'Small housing' }) },
  { id: 'middle', map: base },
  { id: 'large', map: scaledTurbine(base, 1.25, { name: 'Large housing' }) },
].map((h) => ({ id: h.id, name: h.map.name, origin: 'team' as const, map: h.map }));

describe('ranking turbine housings for a chosen compressor', () => {
  const template = templatePlan(doc, 'turbine')!;
  const ranked = rankTurbines({ doc, template, compressor: { id: 'm58', map: demoCompressor('m58') } }, housings);
  const byId = Object.fromEntries(ranked.map((c) => [c.mapId, c]));

  it('judges every housing and orders it by what the exhaust side gives', () => {
    expect(ranked).toHaveLength(3);
    // A smaller housing passes the same flow at a higher expansion ratio: higher drive pressure ratio (physics note §5 power balance).
    expect(byId.small.peakDrivePressureRatio!.value).toBeGreaterThan(byId.large.peakDrivePressureRatio!.value);
    // ... and holds the target no later (more turbine power at low flow).
    if (byId.small.boostThreshold && byId.large.boostThreshold) expect(byId.small.boostThreshold.value).toBeLessThanOrEqual(byId.large.boostThreshold.value);
    expect(candidateCsvRows(ranked, 'turbine')[0][1]).toBe('turbine');
  });

  it('needs a plan with an exhaust side as its template', () => {
    const noExhaust = { ...doc, plans: doc.plans.map(({ exhaust: _e, ...p }) => p) };
    expect(templatePlan(noExhaust, 'turbine')).toBeNull();
  });
});

describe('the order of turbine candidates', () => {
  const row = (mapName: string, status: TurbineCandidate['verdict']['status'], threshold: number | null, drive: number): TurbineCandidate => ({
    mapId: mapName,
    mapName,
    origin: 'team',
    areaRatio: null,
    housing: 'single',
    verdict: { status, headline: '', firstReason: null, firstReasonDetail: null, pointsAtLimit: 0, pointsWithWarnings: 0 },
    worstSurgeMargin: null,
    worstChokeMargin: null,
    worstSpeedMargin: null,
    boostThreshold: threshold === null ? null : { value: threshold, scenarioName: 's', rowLabel: 'r', rpm: threshold },
    holdsEveryFullLoadLine: threshold !== null,
    peakDrivePressureRatio: { value: drive, scenarioName: 's', rowLabel: 'r', rpm: 6000 },
    wastegateShareAtPeakPower: null,
  });

  it('puts fits first, then the earliest threshold, then the lowest drive pressure ratio', () => {
    const sorted = sortTurbineCandidates([
      row('late', 'fits', 4500, 1.2),
      row('never', 'fits', null, 1.0),
      row('early but does not fit', 'does-not-fit', 3000, 1.1),
      row('early', 'fits', 3500, 1.6),
      row('early, lower drive', 'fits', 3500, 1.4),
    ]);
    // Invented rows; the order follows the rule by construction.
    expect(sorted.map((r) => r.mapName)).toEqual(['early, lower drive', 'early', 'late', 'never', 'early but does not fit']);
  });
});
