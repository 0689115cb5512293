import { describe, expect, it } from 'vitest';
import type { DocumentChange } from '#shared/study/diff';
import { changeValueText } from '#src/features/studies/components/workspace/ChangeList';

const change = (kind: DocumentChange['kind'], before: unknown, after: unknown): DocumentChange => ({
  path: 'Plan “A” › x',
  keys: ['plans', 0, 'x'],
  change: 'changed',
  before,
  after,
  kind,
});

describe('a change of the revision history in words', () => {
  it('reads a turbine map taken off a plan (stored as null) as none, not as "null"', () => {
    const c = change('text', 'builtin-turbine-t64-ar064-single', null);
    expect(changeValueText(c, c.before, 'si')).toBe('“builtin-turbine-t64-ar064-single”');
    expect(changeValueText(c, c.after, 'si')).toBe('none');
  });

  it('reads a wastegate valve diameter in mm, or in inches for US units', () => {
    const c = change('diameter', 0.038, 0.0508);
    expect(changeValueText(c, c.before, 'si')).toBe('38 mm'); // 0.038 m = 38 mm (definition)
    expect(changeValueText(c, c.after, 'us')).toBe('2 in'); // 50.8 mm = 2 in (1 in = 25.4 mm, NIST SP 811)
  });
});
