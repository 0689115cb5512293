import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';
import { studyDocumentSchema, studyInputOf, toStudyInput } from '#shared/schemas/study';
import { planTurbineModels, runStudyDocument } from '#shared/study/run';
import { exhaustOf } from '../matching/exhaust/fixtures';

describe('a saved study with turbine maps', () => {
  const demo = JSON.parse(readFileSync(new URL('../../../data/demo/hillclimb-study.json', import.meta.url), 'utf8'));
  const maps: Record<string, SpoolbookMap> = {};
  for (const id of ['compressor-s44', 'compressor-m58', 'compressor-l76', 'turbine-t64-ar064-single', 'turbine-t64-ar082-divided']) {
    const parsed = parseMapFile(readFileSync(new URL(`../../../data/maps/${id}.csv`, import.meta.url), 'utf8'));
    if (parsed.ok) maps[`builtin-${id}`] = parsed.map;
  }

  it('keeps turbineMapId beside the plan, out of the engine input, and reads absent as none', () => {
    const doc = structuredClone(demo);
    doc.plans[0].turbineMapId = 'builtin-turbine-t64-ar064-single';
    doc.plans[0].exhaust = exhaustOf();
    doc.plans[1].turbineMapId = null;
    const parsed = studyDocumentSchema.parse(doc);
    expect(parsed.plans[0].turbineMapId).toBe('builtin-turbine-t64-ar064-single');
    expect(parsed.plans[1].turbineMapId).toBeNull();
    expect('turbineMapId' in parsed.plans[2]).toBe(false); // absent stays absent: a document without it reads back unchanged
    const input = studyInputOf(parsed) as { plans: Record<string, unknown>[] };
    expect(input.plans.every((p) => !('turbineMapId' in p))).toBe(true);
    expect(toStudyInput(parsed).plans[0].exhaust).toEqual(exhaustOf());
    expect(planTurbineModels(parsed, maps).map((m) => m !== null)).toEqual([true, false, false]);
  });

  it('runs through runStudyDocument with its turbine maps, and refuses a compressor map as the turbine quietly (no model)', () => {
    const doc = structuredClone(demo);
    doc.plans[2].turbineMapId = 'builtin-turbine-t64-ar082-divided';
    doc.plans[2].exhaust = exhaustOf({ housing: 'divided', wastegates: { count: 2, valveDiameter: 0.032, dischargeCoefficient: 0.8 } });
    doc.plans[1].turbineMapId = 'builtin-compressor-m58';
    doc.plans[1].exhaust = exhaustOf();
    const parsed = studyDocumentSchema.parse(doc);
    const result = runStudyDocument(parsed, maps);
    const l76 = result.lines.find((l) => l.planIndex === 2)!;
    expect(l76.exhaust?.boostThresholdRpm).not.toBeNull();
    const m58 = result.lines.find((l) => l.planIndex === 1)!;
    expect(m58.points[0].findings.map((f) => f.code)).toContain('turbine-map-missing'); // a compressor map is no turbine model (design)
  });
});
