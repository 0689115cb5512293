import { describe, expect, it } from 'vitest';
import { familyMember } from '#shared/maps/family/similarity';
import { runStudyDocument } from '#shared/study/run';
import { baseDocument, boxMap } from '#tests/unit/candidates/helpers';

// A plan judged on an estimated map (made by a family rule) says so in its findings; a measured one does not.
describe('a study using an estimated compressor map', () => {
  const parent = boxMap('Parent', 1);
  const made = familyMember({ id: 'parent', map: parent }, { kind: 'diameter', diameterRatio: 1.1, sizeEffect: false }, 'Parent × 1.1');
  if (!made.ok) throw new Error(made.message);
  const doc = baseDocument();
  const withMap = (id: string) => ({ ...doc, plans: [{ ...doc.plans[0], compressorMapId: id }] });

  it('names the map, its parent and the rule in a note on each line', () => {
    const result = runStudyDocument(withMap('child'), { child: made.map });
    const notes = result.lines.flatMap((l) => l.points.flatMap((p) => p.findings)).filter((f) => f.code === 'map-estimate');
    expect(notes).toHaveLength(result.lines.length);
    expect(notes[0].severity).toBe('info');
    expect(notes[0].message).toContain('“Parent × 1.1” is an estimate made from “Parent” by diameter × 1.1');
  });

  it('says nothing of the kind for a measured map', () => {
    const result = runStudyDocument(withMap('parent'), { parent });
    expect(result.lines.flatMap((l) => l.points.flatMap((p) => p.findings)).some((f) => f.code === 'map-estimate')).toBe(false);
  });
});
