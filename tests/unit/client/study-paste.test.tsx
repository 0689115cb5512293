import { describe, expect, it } from 'vitest';
import { applyPaste, parsePastedTable } from '#src/features/studies/lib/paste-table';

// Pasting a column, or rpm and value columns, from a spreadsheet into a table by rpm.

describe('parsePastedTable', () => {
  it('reads one column of values, as a spreadsheet puts it on the clipboard (CRLF, trailing newline)', () => {
    expect(parsePastedTable('90\r\n96\r\n101\r\n')).toEqual({ ok: true, kind: 'values', values: [90, 96, 101] });
  });

  it('reads two tab-separated columns as rpm and value, skipping a header line', () => {
    expect(parsePastedTable('rpm\tVE %\n2500\t90\n3500\t96.5\n')).toEqual({
      ok: true,
      kind: 'rows',
      rows: [
        { rpm: 2500, value: 90 },
        { rpm: 3500, value: 96.5 },
      ],
    });
  });

  it('takes a decimal comma where cells are split by tabs or semicolons, where it cannot be a separator', () => {
    expect(parsePastedTable('2500\t0,86\n4500\t0,8')).toEqual({
      ok: true,
      kind: 'rows',
      rows: [
        { rpm: 2500, value: 0.86 },
        { rpm: 4500, value: 0.8 },
      ],
    });
    expect(parsePastedTable('2500;0,86\n4500;0,8')).toEqual({
      ok: true,
      kind: 'rows',
      rows: [
        { rpm: 2500, value: 0.86 },
        { rpm: 4500, value: 0.8 },
      ],
    });
  });

  it('splits comma-separated text as columns, and spaces too', () => {
    expect(parsePastedTable('2500, 0.86\n4500, 0.8')).toEqual({
      ok: true,
      kind: 'rows',
      rows: [
        { rpm: 2500, value: 0.86 },
        { rpm: 4500, value: 0.8 },
      ],
    });
    expect(parsePastedTable('2500   12.5\n4000 20')).toEqual({
      ok: true,
      kind: 'rows',
      rows: [
        { rpm: 2500, value: 12.5 },
        { rpm: 4000, value: 20 },
      ],
    });
  });

  it('accepts a percent sign after a number', () => {
    expect(parsePastedTable('90%\n96 %')).toEqual({ ok: true, kind: 'values', values: [90, 96] });
  });

  it('refuses what is not numbers, naming the line and the cell', () => {
    expect(parsePastedTable('90\nabc\n96')).toEqual({ ok: false, message: 'Line 2: “abc” is not a number.' });
  });

  it('refuses rows of different widths and more than two columns', () => {
    expect(parsePastedTable('2500\t90\n3500')).toEqual({ ok: false, message: 'Line 2 has 1 cells where the first has 2.' });
    expect(parsePastedTable('2500\t90\t1\n3500\t96\t1').ok).toBe(false);
  });

  it('refuses an rpm column that does not increase', () => {
    expect(parsePastedTable('3500\t96\n2500\t90')).toEqual({ ok: false, message: 'The rpm column must increase from line to line (3500 then 2500).' });
  });

  it('says so when there is nothing, or only a header', () => {
    expect(parsePastedTable('  \n\n').ok).toBe(false);
    expect(parsePastedTable('rpm\tVE').ok).toBe(false);
  });
});

describe('applyPaste', () => {
  const rows = [
    { rpm: 2500, value: 0.9 },
    { rpm: 3500, value: 0.96 },
    { rpm: 4500, value: 1.01 },
  ];
  const percent = (shown: number) => shown / 100;

  it('fills values from the row pasted into, keeping each row its rpm, converting from the shown unit', () => {
    const result = applyPaste(rows, parsePastedTable('97\n102'), 1, percent);
    expect(result).toEqual({
      ok: true,
      rows: [
        { rpm: 2500, value: 0.9 },
        { rpm: 3500, value: 0.97 },
        { rpm: 4500, value: 1.02 },
      ],
      summary: 'Pasted 2 values into rows 2 to 3.',
    });
  });

  it('replaces the table with pasted rows', () => {
    const result = applyPaste(rows, parsePastedTable('3000\t95\n6000\t105'), 2, percent);
    expect(result).toEqual({
      ok: true,
      rows: [
        { rpm: 3000, value: 0.95 },
        { rpm: 6000, value: 1.05 },
      ],
      summary: 'The table now has the 2 pasted rows.',
    });
  });

  it('refuses more values than rows below, saying how to add rows', () => {
    const result = applyPaste(rows, parsePastedTable('97\n102\n99'), 1, percent);
    expect(result.ok).toBe(false);
    expect(!result.ok && result.message).toMatch(/3 values were pasted from row 2, but the table has only 2 rows from there/);
  });
});
