import { describe, expect, it } from 'vitest';
import { parseMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';
import { parseStudyInput, StudyInputError } from '#shared/matching';
import { studyDocumentSchema, studyInputOf, toStudyInput } from '#shared/schemas/study';
import { planTurbineModels, runStudyDocument } from '#shared/study/run';
import { readFileSync } from 'node:fs';
import { exhaustOf, exhaustStudy } from './helpers';

const issuesOf = (input: unknown): string[] => {
  try {
    parseStudyInput(input);
    return [];
  } catch (err) {
    if (!(err instanceof StudyInputError)) throw err;
    return err.issues.map((i) => `${i.path}: ${i.message}`);
  }
};

describe('the exhaust block of a Plan', () => {
  it('is optional, and a valid one passes', () => {
    expect(issuesOf(exhaustStudy([exhaustOf()]))).toEqual([]);
    const without = exhaustStudy([exhaustOf()]);
    delete without.plans[0].exhaust;
    expect(issuesOf(without)).toEqual([]);
  });

  it('refuses unit slips and impossible values by field path', () => {
    const bad = (change: Record<string, unknown>) => issuesOf(exhaustStudy([{ ...exhaustOf(), ...change } as never]));
    expect(bad({ wastegates: { count: 1, valveDiameter: 44, dischargeCoefficient: 0.8 } })[0]).toMatch(
      /^plans\.0\.exhaust\.wastegates\.valveDiameter: .*44 mm = 0\.044 m/,
    );
    expect(bad({ wastegates: { count: 3, valveDiameter: 0.04, dischargeCoefficient: 0.8 } })[0]).toMatch(/^plans\.0\.exhaust\.wastegates\.count: /);
    expect(
      bad({
        turbineInletTemperature: [
          { rpm: 3000, value: 850 },
          { rpm: 2000, value: 900 },
        ],
      })[0],
    ).toMatch(/increasing rpm/);
    expect(bad({ turbineInletTemperature: [{ rpm: 3000, value: 250 }] })[0]).toMatch(/turbineInletTemperature\.0\.value: .*K/);
    expect(bad({ mechanicalEfficiency: 95 })[0]).toMatch(/^plans\.0\.exhaust\.mechanicalEfficiency: .*not a percentage/);
    expect(bad({ pulseFactor: 1.2 })[0]).toMatch(/^plans\.0\.exhaust\.pulseFactor: the pulse factor applies only to a divided housing/);
    expect(bad({ housing: 'twin' })[0]).toMatch(/housing must be single or divided/);
    expect(bad({ backPressure: 1 })[0]).toMatch(/backPressure/); // strict: an unknown key is named
    expect(issuesOf(exhaustStudy([exhaustOf({ housing: 'divided', pulseFactor: 1.2 })]))).toEqual([]);
  });
});

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
