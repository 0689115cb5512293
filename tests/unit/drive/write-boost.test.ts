import { describe, expect, it } from 'vitest';
import { driveFigures } from '#shared/drive/figures';
import { gearRowLabel, withUsableBoostByGear } from '#shared/drive/write-boost';
import { readStudyDocument } from '#shared/study/document';
import { computed, demoDriveDocument } from './helpers';

describe('writing the usable boost as boost by gear', () => {
  const doc = demoDriveDocument('compressor');
  const figures = driveFigures(doc, computed(doc).result)!;

  it('adds one gear row per gear to the scenario, keeping its other rows, and the document stays valid', () => {
    const written = withUsableBoostByGear(doc, figures, 1, 0);
    if (!written.ok) throw new Error(written.message);
    const rows = written.document.scenarios[0].boostSchedule;
    expect(rows.map((r) => r.label)).toEqual(['Full load', ...[1, 2, 3, 4].map(gearRowLabel)]);
    expect(readStudyDocument(written.document).ok).toBe(true);
    // Gear 1 takes the usable boost where it is known, the old target where the point is not reachable.
    const gear1 = figures.gears.find((g) => g.planIndex === 1 && g.gear === 1)!;
    gear1.points.forEach((p, i) => {
      if (p.usableBoost !== null) expect(rows[1].boost[i].value).toBe(Math.round(p.usableBoost));
      else expect(rows[1].boost[i].value).toBe(Math.round(p.boostTarget!));
    });
  });

  it('lowers the force to the tyres once the engine recomputes on the written rows', () => {
    const written = withUsableBoostByGear(doc, figures, 1, 0);
    if (!written.ok) throw new Error(written.message);
    const after = driveFigures(written.document, computed(written.document).result)!;
    const before = figures.gears.find((g) => g.planIndex === 1 && g.gear === 2)!.points;
    const now = after.gears.find((g) => g.planIndex === 1 && g.gear === 2)!;
    expect(now.rowLabel).toBe(gearRowLabel(2));
    // Lower boost, less torque: wherever both give a force, it is lower now (by construction).
    let lower = 0;
    now.points.forEach((p, i) => {
      if (p.wheelForce !== null && before[i].wheelForce !== null && before[i].wheelForce! > before[i].tractionLimit) {
        expect(p.wheelForce).toBeLessThan(before[i].wheelForce!);
        lower++;
      }
    });
    expect(lower).toBeGreaterThan(0);
  });

  it('replaces the gear rows of the same gears, and refuses more rows than a schedule holds', () => {
    const third = withUsableBoostByGear(doc, figures, 0, 2); // "Sea level, by gear" has rows for gears 1, 2 and 3
    if (!third.ok) throw new Error(third.message);
    expect(third.document.scenarios[2].boostSchedule.map((r) => r.gear ?? null)).toEqual([1, 2, 3, 4]);
    const crowded = { ...doc, scenarios: doc.scenarios.map((s, i) => (i === 0 ? { ...s, boostSchedule: Array(17).fill(s.boostSchedule[0]) } : s)) };
    expect(withUsableBoostByGear(crowded, figures, 0, 0)).toEqual({ ok: false, message: 'scenario "Sea level, 20 °C" would have 21 boost rows; at most 20' });
  });
});
