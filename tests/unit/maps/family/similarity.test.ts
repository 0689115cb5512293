import { describe, expect, it } from 'vitest';
import { familyMember, moodyEfficiency } from '#shared/maps/family/similarity';
import { parseMapFile, writeMapFile } from '#shared/maps';
import { expectClose } from '#tests/unit/expect-close';
import { boxMap } from '#tests/unit/candidates/helpers';

// The hand-made parent: speed lines 60 000 … 180 000 rpm, flows 0.02 … 1.0 kg/s, efficiency 0.75,
// rated 200 000 rpm (tests/unit/candidates/helpers.ts).
const parent = boxMap('Parent', 1);
const speedLine = (map: typeof parent, i: number) => map.curves.filter((c) => c.kind === 'speed')[i];

describe('a larger wheel by the similarity laws at equal tip speed', () => {
  const result = familyMember({ id: 'parent', map: parent }, { kind: 'diameter', diameterRatio: 1.2, sizeEffect: false }, 'Parent × 1.2');
  if (!result.ok) throw new Error(result.message);
  const child = result.map;

  it('scales corrected flow with D² and speed with 1/D, keeping pressure ratio and efficiency', () => {
    // ṁ₂ = ṁ₁·(D₂/D₁)² = 0.1·1.44 = 0.144 kg/s (Dixon & Hall 7th ed. ch. 1: equal φ = ṁ/(ρND³) at equal ND).
    expectClose(speedLine(child, 1).points[1].correctedMassFlow, 0.144, 1e-12);
    // N₂ = N₁·D₁/D₂ = 100 000/1.2 = 83 333 rpm, rounded to whole rpm (equal tip speed U = πDN/60).
    expect(speedLine(child, 1).points[1].speed).toBe(83_333);
    expect(speedLine(child, 1).label).toBe('83333');
    // Rated speed 200 000/1.2 = 166 667 rpm (equal tip speed).
    expect(child.maxSpeed).toBe(166_667);
    // PR₂ = PR₁ = 1.8 − 0.1·0.1 = 1.79 and η₂ = η₁ = 0.75 (equal ψ = Δh/(ND)²; by construction of the parent).
    expect(speedLine(child, 1).points[1].pressureRatio).toBe(speedLine(parent, 1).points[1].pressureRatio);
    expect(speedLine(child, 1).points[1].efficiency).toBe(0.75);
  });

  it('says it is an estimate, with its parent and rule, and survives the map file', () => {
    expect(child.estimate).toMatchObject({ parentId: 'parent', parentName: 'Parent' });
    expect(child.notes[0]).toMatch(/^Estimate: made from “Parent” by diameter × 1.2/);
    const reread = parseMapFile(writeMapFile(child));
    expect(reread.ok).toBe(true);
  });
});

describe("Moody's size effect on efficiency", () => {
  it('raises a larger wheel’s efficiency by (1 − η₂)/(1 − η₁) = (D₁/D₂)^(1/5)', () => {
    // 1 − 0.25·1.2^(−0.2) = 1 − 0.25·0.964193 = 0.758952 (Moody's formula, Dixon & Hall 7th ed. ch. 1; worked by hand).
    expectClose(moodyEfficiency(0.75, 1.2), 0.758952, 1e-5);
    const r = familyMember({ id: 'parent', map: parent }, { kind: 'diameter', diameterRatio: 1.2, sizeEffect: true }, 'Parent × 1.2, size effect');
    if (!r.ok) throw new Error(r.message);
    expectClose(speedLine(r.map, 0).points[0].efficiency!, 0.758952, 1e-5);
  });
});

describe('a trim change on the same exducer', () => {
  it('scales flow with the inducer area and keeps the speed lines', () => {
    const r = familyMember({ id: 'parent', map: parent }, { kind: 'trim', parentTrim: 50, trim: 53 }, 'Parent, trim 53');
    if (!r.ok) throw new Error(r.message);
    // ṁ₂ = ṁ₁·53/50 = 0.1·1.06 = 0.106 kg/s (flow with inducer area; common practice, no source).
    expectClose(speedLine(r.map, 2).points[1].correctedMassFlow, 0.106, 1e-12);
    expect(speedLine(r.map, 2).points[1].speed).toBe(140_000);
    expect(r.map.maxSpeed).toBe(200_000);
  });
});

describe('outside the honest range', () => {
  it('refuses a trim change over 10 % with the range it accepts', () => {
    const r = familyMember({ id: 'parent', map: parent }, { kind: 'trim', parentTrim: 50, trim: 60 }, 'x');
    expect(r.ok).toBe(false);
    // 60/50 = 1.2, a 20 % change; the range ±10 % of 50 is 45 to 55 (common practice, no source).
    if (!r.ok) expect(r.message).toContain("20 %; the rule holds only within ±10 % of the parent's trim (45 to 55)");
  });

  it('refuses a diameter ratio beyond 0.5 … 2', () => {
    for (const diameterRatio of [0.4, 2.5, Number.NaN]) {
      const r = familyMember({ id: 'parent', map: parent }, { kind: 'diameter', diameterRatio, sizeEffect: false }, 'x');
      expect(r.ok, String(diameterRatio)).toBe(false);
      if (!r.ok) expect(r.message).toMatch(/^diameterRatio must be between 0.5 and 2/);
    }
  });
});
