import { describe, expect, it } from 'vitest';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import { planVerdicts, reasonText, verdictOf } from '#shared/matching/verdict';
import { baseStudy, fakeModel } from './fixtures';

describe('the verdict of a plan', () => {
  it('fits when every point is on the map with the required margins', () => {
    const result = runStudy(parseStudyInput(baseStudy()), { compressorModels: [fakeModel({ surgeSlope: 0.01 })] });
    const [v] = planVerdicts(result);
    expect(v.status).toBe('fits');
    expect(v.reasons).toEqual([]);
    expect(v.headline).toMatch(/^Fits:/);
  });

  it('fits with warnings when a margin is thinner than required, naming it and where', () => {
    const study = baseStudy();
    study.requirements = { minSurgeMargin: 0.5 };
    const [v] = planVerdicts(runStudy(parseStudyInput(study), { compressorModels: [fakeModel({ surgeSlope: 0.06 })] })); // margins 0.3–0.7 on the fake map
    expect(v.status).toBe('fits-with-warnings');
    expect(v.reasons[0].code).toBe('surge-margin-thin');
    expect(v.headline).toMatch(/^Fits with warnings: surge margin thinner than required (from|at) [0-9,–]+ rpm at “Sea level”/);
  });

  it('does not fit when a point crosses a limit, and counts points, not findings', () => {
    const result = runStudy(parseStudyInput(baseStudy()), { compressorModels: [fakeModel({ surgeSlope: 0.3 })] }); // steep surge line: the low speeds surge
    const [v] = planVerdicts(result);
    expect(v.status).toBe('does-not-fit');
    expect(v.reasons[0].code).toBe('map-left-of-surge');
    const limitPoints = result.lines[0].points.filter((p) => p.findings.some((f) => f.severity === 'limit')).length;
    expect(v.pointsAtLimit).toBe(limitPoints); // one count per point (definition)
    expect(reasonText(v.reasons[0])).toMatch(/^left of surge (at|from) 2,000/);
  });

  it('is not judged without a compressor map', () => {
    const [v] = planVerdicts(runStudy(parseStudyInput(baseStudy())));
    expect(v.status).toBe('not-judged');
    expect(v.headline).toMatch(/no compressor map/);
  });

  it('orders reasons: limits first, then the trouble that covers the most points', () => {
    const study = baseStudy();
    study.requirements = { minSurgeMargin: 0.5 };
    // Surge line 0.1·(PR − 1): the two lowest speeds surge, the rest sit right of it by less than 50 %.
    const result = runStudy(parseStudyInput(study), { compressorModels: [fakeModel({ surgeSlope: 0.1 })] });
    const v = verdictOf(result.lines);
    expect(v.reasons[0].severity).toBe('limit');
    expect(v.reasons[0].code).toBe('map-left-of-surge');
    expect(v.reasons[1].code).toBe('surge-margin-thin');
    const severities = v.reasons.map((r) => r.severity);
    expect(severities.indexOf('warning')).toBeGreaterThan(severities.lastIndexOf('limit'));
  });
});
