import type { RpmTableDraft } from './draft';

/**
 * Reads a column, or two columns (rpm and value), copied from a spreadsheet. Cells are split on
 * tabs (what spreadsheets put on the clipboard), else on semicolons, else on commas or runs of
 * spaces. A first line that is not numbers is taken as a header and skipped. A decimal comma
 * ("0,95") is accepted only when cells are split by tabs or semicolons, where it cannot be a
 * separator. Values stay in the units the user sees; the caller converts.
 */
export type PastedTable =
  { ok: true; kind: 'values'; values: number[] } | { ok: true; kind: 'rows'; rows: { rpm: number; value: number }[] } | { ok: false; message: string };

function splitLine(line: string): { cells: string[]; commaIsDecimal: boolean } {
  if (line.includes('\t')) return { cells: line.split('\t'), commaIsDecimal: true };
  if (line.includes(';')) return { cells: line.split(';'), commaIsDecimal: true };
  if (/,\s*\S/.test(line) && !/^\s*-?\d+,\d+\s*$/.test(line)) return { cells: line.split(','), commaIsDecimal: false };
  return { cells: line.trim().split(/\s+/), commaIsDecimal: true };
}

function readNumber(cell: string, commaIsDecimal: boolean): number | null {
  let t = cell.trim().replace(/^−/, '-').replace(/%$/, '').trim();
  if (commaIsDecimal && /^-?\d+,\d+$/.test(t)) t = t.replace(',', '.');
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

export function parsePastedTable(text: string): PastedTable {
  const lines = text
    .replace(/\r\n?/g, '\n')
    .split('\n')
    // A percent sign, with or without a space before it, says nothing the column header does not.
    .map((l) => l.replace(/\s*%/g, '').replace(/\s+$/, ''))
    .filter((l) => l.trim() !== '');
  if (lines.length === 0) return { ok: false, message: 'Nothing to paste: the clipboard holds no numbers.' };

  const parsed = lines.map((line) => {
    const { cells, commaIsDecimal } = splitLine(line);
    const nonEmpty = cells.map((c) => c.trim()).filter((c) => c !== '');
    return { line, cells: nonEmpty, numbers: nonEmpty.map((c) => readNumber(c, commaIsDecimal)) };
  });
  const body = parsed[0].numbers.some((n) => n === null) ? parsed.slice(1) : parsed;
  if (body.length === 0) return { ok: false, message: 'Only a header line was pasted; copy the numbers below it too.' };

  const width = body[0].cells.length;
  if (width < 1 || width > 2) {
    return { ok: false, message: `Paste one column (values) or two columns (rpm and value); line 1 has ${width} cells.` };
  }
  for (let i = 0; i < body.length; i++) {
    const row = body[i];
    const lineNo = parsed.indexOf(row) + 1;
    if (row.cells.length !== width) return { ok: false, message: `Line ${lineNo} has ${row.cells.length} cells where the first has ${width}.` };
    const bad = row.numbers.findIndex((n) => n === null);
    if (bad >= 0) return { ok: false, message: `Line ${lineNo}: “${row.cells[bad]}” is not a number.` };
  }
  if (width === 1) return { ok: true, kind: 'values', values: body.map((r) => r.numbers[0]!) };
  const rows = body.map((r) => ({ rpm: r.numbers[0]!, value: r.numbers[1]! }));
  for (let i = 1; i < rows.length; i++) {
    if (!(rows[i].rpm > rows[i - 1].rpm))
      return { ok: false, message: `The rpm column must increase from line to line (${rows[i - 1].rpm} then ${rows[i].rpm}).` };
  }
  return { ok: true, kind: 'rows', rows };
}

/**
 * Puts a pasted table into `rows`: two columns replace the table; one column fills the values
 * from row `start` down, keeping each row's rpm. `toSI` converts a value from the shown unit.
 */
export function applyPaste(
  rows: RpmTableDraft,
  pasted: PastedTable,
  start: number,
  toSI: (shown: number) => number,
): { ok: true; rows: RpmTableDraft; summary: string } | { ok: false; message: string } {
  if (!pasted.ok) return pasted;
  if (pasted.kind === 'rows') {
    const n = pasted.rows.length;
    return {
      ok: true,
      rows: pasted.rows.map((r) => ({ rpm: r.rpm, value: toSI(r.value) })),
      summary: `The table now has the ${n} pasted row${n === 1 ? '' : 's'}.`,
    };
  }
  const room = rows.length - start;
  if (pasted.values.length > room) {
    return {
      ok: false,
      message: `${pasted.values.length} values were pasted from row ${start + 1}, but the table has ${room === 1 ? 'only 1 row' : `only ${room} rows`} from there. Paste two columns (rpm and value) to set the rows too.`,
    };
  }
  const next = rows.map((r, i) => (i >= start && i < start + pasted.values.length ? { rpm: r.rpm, value: toSI(pasted.values[i - start]) } : r));
  const n = pasted.values.length;
  return { ok: true, rows: next, summary: `Pasted ${n} value${n === 1 ? '' : 's'} into rows ${start + 1} to ${start + n}.` };
}
