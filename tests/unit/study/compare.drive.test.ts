import { describe, expect, it } from 'vitest';
import { DRIVE_ROW_KEYS, compareLines, type PlanDriveFigures } from '#shared/study/compare';
import { computed, demoDriveDocument } from '../drive/helpers';
import { studyDrive } from '#shared/drive/study-drive';

describe('Side by side with a vehicle', () => {
  const doc = demoDriveDocument('turbineHousing');
  const { result, models } = computed(doc);
  const drive = studyDrive(doc, result, models)!;
  const lines = result.lines.filter((l) => l.scenarioIndex === 0);

  it('adds time to boost and the acceleration run, lowest best, before the counts', () => {
    const rows = compareLines(lines.map((l) => ({ ...l, drive: drive.byPlan[l.planIndex] })));
    const keys = rows.map((r) => r.key);
    expect(keys.slice(keys.indexOf('timeToBoost'), keys.indexOf('timeToBoost') + 3)).toEqual([...DRIVE_ROW_KEYS]);
    expect(keys.indexOf('runDistance') + 1).toBe(keys.indexOf('pointsAtLimit'));
    const time = rows.find((r) => r.key === 'timeToBoost')!;
    expect(time.cells.map((c) => c.value)).toEqual(drive.spools.map((s) => s.timeTo90));
    // The demo's smaller single-scroll housing spools first (its turbine has more to give at low flow; the demo maps by construction).
    expect(time.bestIndices).toEqual([0]);
  });

  it('says "unknown" where a plan has no figure, and adds nothing without a vehicle', () => {
    const none: PlanDriveFigures = { timeToBoost: null, timeToBoostWhy: 'no turbine', runTime: null, runDistance: null, runWhy: 'x' };
    const rows = compareLines(lines.map((l) => ({ ...l, drive: none })));
    expect(rows.find((r) => r.key === 'runTime')!.cells.every((c) => c.note === 'unknown')).toBe(true);
    expect(compareLines(lines).some((r) => DRIVE_ROW_KEYS.includes(r.key))).toBe(false);
  });
});
