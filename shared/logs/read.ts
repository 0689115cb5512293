/**
 * Reads a logger's text export into numeric columns: any of tab, semicolon, comma or bar as the
 * delimiter, decimal comma or point, lines of notes above the column names, and units either in
 * the names ("MAP (kPa)", "IAT [°C]") or on a line of their own under them. Pure (papaparse on a
 * string), so the browser's worker and the server read a file the same way.
 */
import Papa from 'papaparse';

/** A cell that could not be read as a number, or a row of the wrong width. */
export interface ReadProblem {
  /** 1-based line of the file. */
  line: number;
  /** 1-based column, absent for a whole row. */
  column?: number;
  message: string;
}

export interface LogTable {
  /** Column names as the file gives them (made unique: a repeated name gets " (2)"). */
  names: string[];
  /** Unit text the file gives for each column (from the name or the units line), or null. */
  headerUnits: (string | null)[];
  /** One array per column; NaN where a cell is empty or unreadable. */
  columns: Float64Array[];
  /** File line (1-based) of each row. */
  rowLines: Int32Array;
  rowCount: number;
  delimiter: string;
  decimalComma: boolean;
  /** Line of the names (null when the file has none and columns are numbered), and of the units. */
  namesLine: number | null;
  unitsLine: number | null;
  /** Unreadable cells per column. */
  unreadable: number[];
  /** Rows with another number of fields than the names; their cells are NaN. */
  raggedRows: number;
  /** The first problems (at most `MAX_PROBLEMS`), by line. */
  problems: ReadProblem[];
}

export type ReadResult = { ok: true; table: LogTable } | { ok: false; problems: ReadProblem[] };

const MAX_PROBLEMS = 50;
const PREVIEW_LINES = 200;
const DELIMITERS = ['\t', ';', ',', '|'] as const;

const DECIMAL_COMMA = /^\s*[-+]?\d*,\d+(?:[eE][-+]?\d+)?\s*$/;
const DECIMAL_POINT = /^\s*[-+]?\d*\.\d+(?:[eE][-+]?\d+)?\s*$/;
const NUMBER_LIKE = /^\s*[-+]?(?:\d+[.,]?\d*|[.,]\d+)(?:[eE][-+]?\d+)?\s*$/;

function numberOf(cell: string, decimalComma: boolean): number {
  if (cell === '') return Number.NaN;
  // Unary plus reads decimals and exponents fast. What it also takes is refused after: a blank
  // (read as 0), Infinity, and hex, binary or octal literals (0x…, 0b…, 0o…), which no logger writes.
  const v = decimalComma ? +cell.replace(',', '.') : +cell;
  if (v !== v || v === Infinity || v === -Infinity) return Number.NaN;
  if (v === 0 && !/\d/.test(cell)) return Number.NaN;
  if (cell.length > 2 && /^\s*[-+]?0[xXbBoO]/.test(cell)) return Number.NaN;
  return v;
}

function isNumeric(cell: string): boolean {
  return NUMBER_LIKE.test(cell);
}

function modalCount(rows: string[][]): { count: number; rows: number } {
  const tally = new Map<number, number>();
  for (const r of rows) if (r.length > 1) tally.set(r.length, (tally.get(r.length) ?? 0) + 1);
  let best = { count: 0, rows: 0 };
  for (const [count, n] of tally) if (n > best.rows || (n === best.rows && count > best.count)) best = { count, rows: n };
  return best;
}

function previewLines(text: string): string[] {
  const lines: string[] = [];
  let start = 0;
  while (lines.length < PREVIEW_LINES && start < text.length) {
    let end = text.indexOf('\n', start);
    if (end === -1) end = text.length;
    lines.push(text.slice(start, end).replace(/\r$/, ''));
    start = end + 1;
  }
  return lines;
}

/** The delimiter that splits most preview lines into the same number (more than one) of fields; earlier candidates win ties, so `;` beats `,` under a decimal comma. */
function chooseDelimiter(lines: string[]): { delimiter: string; rows: string[][] } | null {
  let best: { delimiter: string; rows: string[][]; score: number } | null = null;
  for (const delimiter of DELIMITERS) {
    const rows = Papa.parse<string[]>(lines.join('\n'), { delimiter, skipEmptyLines: false }).data;
    const { rows: score } = modalCount(rows);
    if (score > 0 && (!best || score > best.score)) best = { delimiter, rows, score };
  }
  return best;
}

const UNIT_IN_NAME = /^(.*?)\s*(?:\(([^()]*)\)|\[([^[\]]*)\])\s*$/;

function splitName(raw: string): { name: string; unit: string | null } {
  const m = UNIT_IN_NAME.exec(raw);
  if (m && (m[2] ?? m[3] ?? '').trim() !== '') return { name: raw.trim(), unit: (m[2] ?? m[3]).trim() };
  return { name: raw.trim(), unit: null };
}

function uniqueNames(names: string[]): string[] {
  const seen = new Map<string, number>();
  return names.map((n, i) => {
    const base = n || `Column ${i + 1}`;
    const k = (seen.get(base) ?? 0) + 1;
    seen.set(base, k);
    return k === 1 ? base : `${base} (${k})`;
  });
}

/** Finds the layout from the first lines: delimiter, decimal mark, names and units lines, first data line (0-based). */
function layoutOf(
  text: string,
): { delimiter: string; decimalComma: boolean; width: number; namesRow: number | null; unitsRow: number | null; dataRow: number } | string {
  const lines = previewLines(text);
  if (lines.every((l) => l.trim() === '')) return 'The file is empty.';
  const chosen = chooseDelimiter(lines);
  if (!chosen) return 'No columns found: the file has no line split into several fields by a tab, semicolon, comma or bar.';
  const { delimiter, rows } = chosen;
  const width = modalCount(rows).count;
  let commas = 0;
  let points = 0;
  for (const r of rows)
    for (const c of r) {
      if (DECIMAL_COMMA.test(c)) commas++;
      else if (DECIMAL_POINT.test(c)) points++;
    }
  const decimalComma = delimiter !== ',' && commas > points;
  const numericShare = (r: string[]) => r.filter((c) => c.trim() !== '' && isNumeric(c)).length / Math.max(1, r.filter((c) => c.trim() !== '').length);
  let dataRow = -1;
  for (let i = 0; i < rows.length; i++) {
    if (
      rows[i].length === width &&
      numericShare(rows[i]) >= 0.5 &&
      (i + 1 >= rows.length || rows[i + 1].length !== width || numericShare(rows[i + 1]) >= 0.5)
    ) {
      dataRow = i;
      break;
    }
  }
  if (dataRow === -1) return 'No data found: no line in the first 200 holds numbers in most of its columns.';
  const textRow = (i: number) => i >= 0 && rows[i].length === width && numericShare(rows[i]) < 0.5;
  let namesRow: number | null = null;
  let unitsRow: number | null = null;
  if (textRow(dataRow - 1) && textRow(dataRow - 2)) {
    namesRow = dataRow - 2;
    unitsRow = dataRow - 1;
  } else if (textRow(dataRow - 1)) namesRow = dataRow - 1;
  return { delimiter, decimalComma, width, namesRow, unitsRow, dataRow };
}

/**
 * Reads the whole text. `onProgress` hears the share read (0 to 1) after each chunk, so a
 * worker can show a progress bar. `keep` limits the numbers read to the columns it names (the
 * others come back empty): the server reads only what the mapping uses. A file with no recognisable table answers its problem.
 */
export function readLogTable(text: string, options: { onProgress?: (share: number) => void; keep?: (name: string) => boolean } = {}): ReadResult {
  if (text.includes('\u0000'))
    return { ok: false, problems: [{ line: 1, message: 'The file holds binary data (NUL bytes): export the log as CSV or tab-separated text.' }] };
  const layout = layoutOf(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  if (typeof layout === 'string') return { ok: false, problems: [{ line: 1, message: layout }] };
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const { delimiter, decimalComma, width, namesRow, unitsRow, dataRow } = layout;
  const headerRows = Papa.parse<string[]>(previewLines(body).slice(0, dataRow).join('\n'), { delimiter, skipEmptyLines: false }).data;
  const split = namesRow === null ? null : headerRows[namesRow].map(splitName);
  const names = uniqueNames(split ? split.map((s) => s.name) : Array.from({ length: width }, (_, i) => `Column ${i + 1}`));
  const headerUnits = names.map((_, j) => {
    const fromRow = unitsRow === null ? '' : (headerRows[unitsRow][j] ?? '').trim().replace(/^[([]|[)\]]$/g, '');
    return fromRow || split?.[j]?.unit || null;
  });

  // Row estimate from the line count, so the arrays rarely grow.
  let estimate = 1;
  for (let i = body.indexOf('\n'); i !== -1; i = body.indexOf('\n', i + 1)) estimate++;
  // Rows never outnumber lines: the arrays are allocated once.
  const keep = options.keep;
  const kept = names.map((n) => !keep || keep(n));
  const columns = kept.map((k) => new Float64Array(k ? estimate : 0));
  const lines = new Int32Array(estimate);
  const unreadable = new Array<number>(width).fill(0);
  const problems: ReadProblem[] = [];
  let raggedRows = 0;
  let rowCount = 0;
  let lineIndex = 0;
  const note = (p: ReadProblem) => {
    if (problems.length < MAX_PROBLEMS) problems.push(p);
  };

  // papaparse reads a string in chunks when given `chunkSize` and `chunk` (its types list those for files only).
  const parseInChunks = Papa.parse as unknown as (input: string, config: object) => void;
  parseInChunks(body, {
    delimiter,
    skipEmptyLines: false,
    chunkSize: 1 << 20,
    chunk: (result: Papa.ParseResult<string[]>) => {
      for (const row of result.data) {
        const line = ++lineIndex;
        if (line <= dataRow) continue;
        if (row.length === 1 && row[0].trim() === '') continue;
        const r = rowCount++;
        lines[r] = line;
        if (row.length !== width) {
          raggedRows++;
          note({ line, message: `has ${row.length} field${row.length === 1 ? '' : 's'} where the names have ${width}` });
          for (let j = 0; j < width; j++) if (kept[j]) columns[j][r] = Number.NaN;
          continue;
        }
        for (let j = 0; j < width; j++) {
          if (!kept[j]) continue;
          const cell = row[j];
          const value = numberOf(cell, decimalComma);
          columns[j][r] = value;
          if (value !== value && cell.trim() !== '') {
            unreadable[j]++;
            note({ line, column: j + 1, message: `"${cell.slice(0, 40)}" in column "${names[j]}" is not a number` });
          }
        }
      }
      options.onProgress?.(Math.min(1, result.meta.cursor / Math.max(1, body.length)));
    },
  });
  if (rowCount === 0) return { ok: false, problems: [{ line: dataRow + 1, message: 'The file has column names but no rows of data under them.' }] };
  return {
    ok: true,
    table: {
      names,
      headerUnits,
      columns: columns.map((c) => c.subarray(0, Math.min(rowCount, c.length))),
      rowLines: lines.subarray(0, rowCount),
      rowCount,
      delimiter,
      decimalComma,
      namesLine: namesRow === null ? null : namesRow + 1,
      unitsLine: unitsRow === null ? null : unitsRow + 1,
      unreadable,
      raggedRows,
      problems,
    },
  };
}
