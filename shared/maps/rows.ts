import Papa from 'papaparse';
import { FORMULA_START, MAX_LABEL_LENGTH } from './format';
import { isBlankLine, looksLikeDecimalComma, parseDecimal } from './header';
import { quoteCell, type ProblemList } from './problems';

/** One data row with its numbers read but not yet judged against the map's kind. */
export interface DataRow {
  /** File line, 1-based. */
  line: number;
  curve: string;
  label: string;
  /** Columns 3 to 6 in file units: flow or expansion ratio, pressure ratio or flow parameter, efficiency, speed. */
  values: [number | null, number | null, number | null, number | null];
}

const COLUMN_COUNT = 6;

/** The delimiter a line seems to use when it has no comma, for a plain message instead of column errors. */
export function otherDelimiter(line: string): string | null {
  if (line.includes(',')) return null;
  if (line.includes(';')) return 'semicolons';
  if (line.includes('\t')) return 'tabs';
  if (line.includes('|')) return 'vertical bars';
  return null;
}

/** Splits one line as CSV (for the column-names line). */
export function splitCsvLine(line: string): string[] {
  return Papa.parse<string[]>(line, { delimiter: ',', quoteChar: '"' }).data[0] ?? [];
}

function readNumberCell(text: string, line: number, column: number, columnName: string, problems: ProblemList): number | null | undefined {
  if (text === '') return null;
  const value = parseDecimal(text);
  if (value !== null) return value;
  if (looksLikeDecimalComma(text)) {
    problems.add(
      'decimal-comma',
      line,
      column,
      `${columnName} "${text}" uses a decimal comma; write numbers with a decimal point (${text.replace(/\./g, '').replace(',', '.')})`,
    );
  } else if (FORMULA_START.test(text)) {
    problems.add('formula-cell', line, column, `${columnName} ${quoteCell(text)} looks like a spreadsheet formula; write the number itself`);
  } else {
    problems.add('not-a-number', line, column, `${columnName} ${quoteCell(text)} is not a number`);
  }
  return undefined;
}

/**
 * Reads the rows after the column names with papaparse. Rows keep their file line so that every
 * problem can be placed; a row with any unreadable cell is reported and left out. `complete` is
 * false when an unclosed quote swallowed the rest of the file, so that checks of whole lines are
 * skipped instead of reporting the damage as more problems.
 */
export function readDataRows(
  lines: string[],
  firstDataIndex: number,
  columns: readonly string[],
  curveKinds: readonly string[],
  problems: ProblemList,
): { rows: DataRow[]; complete: boolean } {
  const dataText = lines.slice(firstDataIndex).join('\n');
  const parsed = Papa.parse<string[]>(dataText, { delimiter: ',', newline: '\n', quoteChar: '"', skipEmptyLines: false });
  const rows: DataRow[] = [];
  const rowLines: number[] = [];
  let quoteReported = false;
  let line = firstDataIndex + 1;
  for (const cells of parsed.data) {
    const rowLine = line;
    rowLines.push(rowLine);
    // A quoted cell that runs past the end of its line shifts every later line: count them.
    let breaks = 0;
    for (const c of cells) for (let at = c.indexOf('\n'); at !== -1; at = c.indexOf('\n', at + 1)) breaks++;
    line += 1 + breaks;
    if (breaks > 0) {
      problems.add(
        'unclosed-quote',
        rowLine,
        null,
        'a quoted cell runs past the end of the line (a missing closing quote?); the rest of the file could not be read',
      );
      quoteReported = true;
      break;
    }
    const raw = lines[rowLine - 1] ?? '';
    if (isBlankLine(raw)) continue;
    const row = readRow(cells, raw, rowLine, columns, curveKinds, problems);
    if (row) rows.push(row);
  }
  for (const error of parsed.errors) {
    if (error.type !== 'Quotes' || quoteReported) continue;
    const errorLine = typeof error.row === 'number' ? (rowLines[error.row] ?? null) : null;
    problems.add(
      'unclosed-quote',
      errorLine,
      null,
      'a quote mark is missing or misplaced in this row; quote whole cells only, and close every quote on its own line',
    );
  }
  return { rows, complete: !quoteReported };
}

function readRow(cells: string[], raw: string, line: number, columns: readonly string[], curveKinds: readonly string[], problems: ProblemList): DataRow | null {
  const first = raw.trimStart();
  if (first.startsWith('#') || first.startsWith('"#')) {
    problems.add('header-after-data', line, null, 'header lines ("# key: value") go above the column names, not among the data rows');
    return null;
  }
  let width = cells.length;
  while (width > COLUMN_COUNT && cells[width - 1].trim() === '') width--;
  if (width > COLUMN_COUNT) {
    const hint = /\d,\d/.test(raw) ? '; if the numbers use decimal commas (1,35), write them with a decimal point (1.35)' : '';
    problems.add('column-count', line, null, `this row has ${width} columns; a map row has ${COLUMN_COUNT} (${columns.join(',')})${hint}`);
    return null;
  }
  const text: string[] = [];
  for (let i = 0; i < COLUMN_COUNT; i++) text.push((cells[i] ?? '').trim());
  let readable = true;

  const curve = text[0].toLowerCase();
  if (curve === '') {
    problems.add('missing-value', line, 1, `curve is empty; use one of ${curveKinds.join(', ')}`);
    readable = false;
  } else if (FORMULA_START.test(cells[0] ?? '') || FORMULA_START.test(text[0])) {
    problems.add('formula-cell', line, 1, `curve ${quoteCell(text[0])} looks like a spreadsheet formula; use one of ${curveKinds.join(', ')}`);
    readable = false;
  } else if (!curveKinds.includes(curve)) {
    problems.add('unknown-curve', line, 1, `curve ${quoteCell(text[0])} is not one Spoolbook knows; use one of ${curveKinds.join(', ')}`);
    readable = false;
  }

  const label = text[1];
  if (FORMULA_START.test(cells[1] ?? '') || FORMULA_START.test(label)) {
    problems.add(
      'formula-cell',
      line,
      2,
      `label ${quoteCell(cells[1])} starts with =, +, -, @ or a tab, which a spreadsheet would run as a formula; start it with a letter or digit`,
    );
    readable = false;
  } else if (label.length > MAX_LABEL_LENGTH) {
    problems.add('out-of-range', line, 2, `label is ${label.length} characters long; the limit is ${MAX_LABEL_LENGTH}`);
    readable = false;
  }

  const values: DataRow['values'] = [null, null, null, null];
  for (let i = 0; i < 4; i++) {
    const value = readNumberCell(text[i + 2], line, i + 3, columns[i + 2], problems);
    if (value === undefined) readable = false;
    else values[i] = value;
  }
  return readable ? { line, curve, label, values } : null;
}
