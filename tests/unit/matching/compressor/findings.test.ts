import { describe, expect, it } from 'vitest';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import { baseStudy, fakeModel, solved } from '../fixtures';

describe('required margins', () => {
  it('turns a margin thinner than required into a warning with the figure and the rpm', () => {
    const study = baseStudy();
    const quiet = runStudy(parseStudyInput(study), { compressorModels: [fakeModel({ surgeSlope: 0.01 })] }).lines[0];
    expect(quiet.points.flatMap((p) => p.findings).some((f) => f.code === 'surge-margin-thin')).toBe(false);
    study.requirements = { minSurgeMargin: 0.5 };
    const line = runStudy(parseStudyInput(study), { compressorModels: [fakeModel({ surgeSlope: 0.1 })] }).lines[0];
    const p = line.points[3];
    expect(solved(p).surgeMargin!).toBeGreaterThan(0);
    expect(solved(p).surgeMargin!).toBeLessThan(0.5); // (ṁc − 0.1·(PR − 1))/ṁc of the fake map at 5000 rpm
    const f = p.findings.find((x) => x.code === 'surge-margin-thin')!;
    expect(f.severity).toBe('warning');
    expect(f.value).toBe(solved(p).surgeMargin); // the point's own margin
    expect(f.threshold).toBe(0.5); // the study's requirement
    expect(f.rpm).toBe(5000);
    expect(f.message).toMatch(/under the 50 % the study requires/);
  });
});
