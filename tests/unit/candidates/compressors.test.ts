import { describe, expect, it } from 'vitest';
import { CANDIDATE_CSV_FIELDS, candidateCsvRows, rankCompressors, withCandidatePlan, mapCapacity, MAX_PLANS } from '#shared/candidates';
import { boxMap, baseDocument, candidate } from './helpers';

// An invented library whose ranking is obvious by construction: the same hand-made map at four
// sizes. The base study's engine flows lie between about 0.03 and 0.25 kg/s.
const tiny = boxMap('Tiny', 0.1); // choke at 0.1 kg/s: the upper half of every line is past choke
const right = boxMap('Right', 1); // surge at 0.02 kg/s, choke at 1 kg/s: every point inside, margins wide
const roomy = boxMap('Roomy', 1.3, 0.8); // a little larger and more efficient: still fits
const huge = boxMap('Huge', 30); // surge at 0.6 kg/s: every point left of surge
const library = [tiny, right, roomy, huge].map((m) => candidate(m));
const doc = baseDocument();

describe('ranking compressor candidates', () => {
  it('puts what fits first, and what does not fit after', () => {
    const ranked = rankCompressors(doc, doc.plans[0], library, 'smallest');
    expect(ranked.map((c) => c.verdict.status)).toEqual(['fits', 'fits', 'does-not-fit', 'does-not-fit']);
    expect(ranked.slice(0, 2).map((c) => c.mapName)).toEqual(['Right', 'Roomy']);
    expect(ranked.find((c) => c.mapName === 'Huge')!.verdict.firstReason).toMatch(/^left of surge/);
    expect(ranked.find((c) => c.mapName === 'Tiny')!.verdict.firstReason).toMatch(/past choke|above the map/);
  });

  it('orders the maps that fit by the order chosen', () => {
    // Smallest wheel: Right's choke flow is 1/1.3 of Roomy's (by construction).
    expect(rankCompressors(doc, doc.plans[0], library, 'smallest')[0].mapName).toBe('Right');
    // Widest worst surge margin: Right's surge line sits at 0.02 kg/s, Roomy's at 0.026 kg/s.
    expect(rankCompressors(doc, doc.plans[0], library, 'surge-margin')[0].mapName).toBe('Right');
    // Best efficiency and lowest outlet temperature: Roomy is 0.80 efficient everywhere, Right 0.75.
    expect(rankCompressors(doc, doc.plans[0], library, 'efficiency')[0].mapName).toBe('Roomy');
    expect(rankCompressors(doc, doc.plans[0], library, 'outlet-temperature')[0].mapName).toBe('Roomy');
  });

  it('gives the worst margins with where, and the efficiencies the map reads', () => {
    const [first] = rankCompressors(doc, doc.plans[0], library, 'smallest');
    // The worst surge margin is at the lowest flow: the first rpm of the line (by construction).
    expect(first.worstSurgeMargin).toMatchObject({ scenarioName: 'Sea level', rowLabel: 'Full load', rpm: 2000 });
    expect(first.worstSurgeMargin!.value).toBeGreaterThan(0.05);
    // Every point of the hand-made map reads 0.75 (by construction).
    expect(first.meanFullLoadEfficiency).toBeCloseTo(0.75, 6);
    expect(first.efficiencyAtPeakTorque?.value).toBeCloseTo(0.75, 6);
    expect(first.efficiencyAtPeakPower?.value).toBeCloseTo(0.75, 6);
    expect(first.traces).toHaveLength(1);
  });

  it('says nothing of efficiency where the map cannot deliver the point', () => {
    const tinyRow = rankCompressors(doc, doc.plans[0], library, 'smallest').find((c) => c.mapName === 'Tiny')!;
    expect(tinyRow.efficiencyAtPeakPower?.value).toBeNull();
  });

  it('measures a wheel by its largest choke flow at ISA sea-level reference', () => {
    // 1.0 kg/s at 298.15 K, 100 kPa is 1.0·(100/101.325)·√(288.15/298.15) at 288.15 K, 101.325 kPa (definition of corrected flow; NASA Glenn).
    expect(mapCapacity(right)).toBeCloseTo((100_000 / 101_325) * Math.sqrt(288.15 / 298.15), 9);
  });

  it('writes the CSV columns the contract names, one row per map', () => {
    const ranked = rankCompressors(doc, doc.plans[0], library, 'smallest');
    expect(CANDIDATE_CSV_FIELDS).toEqual(['Map', 'Kind', 'Verdict', 'First reason', 'Worst surge margin', 'Worst choke margin', 'Worst speed margin']);
    const rows = candidateCsvRows(ranked, 'compressor');
    expect(rows).toHaveLength(4);
    expect(rows[0].slice(0, 4)).toEqual(['Right', 'compressor', 'Fits', '']);
  });
});

describe('adding a candidate as a plan', () => {
  it('adds a plan with the map and the template plan’s turbochargers', () => {
    const added = withCandidatePlan(doc, { mapId: 'map-Right', mapName: 'Right' });
    expect(added.ok).toBe(true);
    if (!added.ok) return;
    const plan = added.document.plans.at(-1)!;
    expect(plan).toMatchObject({ id: added.planId, name: 'Right', compressorMapId: 'map-Right', turbochargers: 1 });
    expect(new Set(added.document.plans.map((p) => p.id)).size).toBe(added.document.plans.length);
  });

  it('refuses an eleventh plan with the reason', () => {
    const full = { ...doc, plans: Array.from({ length: MAX_PLANS }, (_, i) => ({ ...doc.plans[0], id: `p${i}` })) };
    const added = withCandidatePlan(full, { mapId: 'map-Right', mapName: 'Right' });
    expect(added).toEqual({ ok: false, message: expect.stringContaining('at most 10 plans') });
  });
});
