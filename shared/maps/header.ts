import Papa from 'papaparse';
import {
  ALL_HEADER_KEYS,
  EFFICIENCY_SCALES,
  FORMULA_START,
  HEADER_KEYS,
  MAP_FORMAT_VERSION,
  MAP_KINDS,
  MAX_MAP_NAME_LENGTH,
  MAX_NOTES_LENGTH,
  type EfficiencyScale,
  type MapKind,
} from './format';
import { quoteCell, type ProblemList } from './problems';
import { readUnit, mapValueToSI, type MapQuantity } from './units';

/** One `# key: value` line. */
export interface HeaderEntry {
  key: string;
  value: string;
  /** File line, 1-based. */
  line: number;
}

export interface HeaderSection {
  /** Entries by lower-case key; `note` lines are in `notes` instead. */
  entries: Map<string, HeaderEntry>;
  notes: HeaderEntry[];
  /** Index (0-based) of the first line that is neither blank nor a header line: the column names. */
  columnLineIndex: number;
}

/** A blank line, or one a spreadsheet wrote as nothing but commas. */
export function isBlankLine(line: string): boolean {
  return /^[\s,]*$/.test(line);
}

/**
 * The text of a header line, or null when the line is not one. A spreadsheet that opened the file
 * pads header lines with commas (`# kind: compressor,,,,`) or quotes them when they hold a comma;
 * both are undone here so that a file edited in a spreadsheet still reads.
 */
function headerText(line: string): string | null {
  const trimmed = line.trim();
  if (trimmed.startsWith('#')) return trimmed.replace(/[,\s]+$/, '');
  if (!trimmed.startsWith('"#')) return null;
  const cells = Papa.parse<string[]>(trimmed, { delimiter: ',' }).data[0] ?? [];
  while (cells.length > 0 && cells[cells.length - 1].trim() === '') cells.pop();
  return cells.join(',').trim();
}

function editDistance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let diagonal = row[0];
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const above = row[j];
      row[j] = Math.min(row[j] + 1, row[j - 1] + 1, diagonal + (a[i - 1] === b[j - 1] ? 0 : 1));
      diagonal = above;
    }
  }
  return row[b.length];
}

function closestKey(key: string): string | null {
  let best: string | null = null;
  let bestDistance = Infinity;
  for (const known of ALL_HEADER_KEYS) {
    const d = editDistance(key, known);
    if (d < bestDistance) [best, bestDistance] = [known, d];
  }
  return bestDistance <= Math.max(2, Math.floor(key.length / 3)) ? best : null;
}

/** Reads the `# key: value` lines at the top of the file (blank lines between them are allowed). */
export function readHeaderSection(lines: string[], problems: ProblemList): HeaderSection {
  const entries = new Map<string, HeaderEntry>();
  const notes: HeaderEntry[] = [];
  let index = 0;
  for (; index < lines.length; index++) {
    const line = index + 1;
    if (isBlankLine(lines[index])) continue;
    const text = headerText(lines[index]);
    if (text === null) break;
    const body = text.replace(/^#\s*/, '');
    if (body === '') continue;
    const match = /^([^:]*?)\s*:\s*(.*)$/.exec(body);
    if (!match || match[1].trim() === '') {
      problems.add('header-syntax', line, null, `a header line reads "# key: value"; this one has no key and colon: ${quoteCell(text)}`);
      continue;
    }
    const key = match[1].trim().toLowerCase().replace(/\s+/g, ' ');
    const entry: HeaderEntry = { key, value: match[2].trim(), line };
    if (key === HEADER_KEYS.note) {
      notes.push(entry);
      continue;
    }
    if (!ALL_HEADER_KEYS.includes(key)) {
      const suggestion = closestKey(key);
      problems.add(
        'unknown-key',
        line,
        null,
        `unknown header key "${match[1].trim()}"${suggestion ? `; did you mean "${suggestion}"?` : ''} (free text goes in "# note: …" lines)`,
      );
      continue;
    }
    const earlier = entries.get(key);
    if (earlier) {
      problems.add('duplicate-key', line, null, `header key "${key}" is given twice (first on line ${earlier.line})`);
      continue;
    }
    entries.set(key, entry);
  }
  return { entries, notes, columnLineIndex: index };
}

/** Header values every map carries. */
export interface CommonHeader {
  kind: MapKind | null;
  name: string | null;
  notes: string[];
  efficiency: EfficiencyScale | null;
  speedUnit: string;
}

const NUMBER_TEXT = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Parses a number written with a decimal point; null when the text is not one. */
export function parseDecimal(text: string): number | null {
  if (!NUMBER_TEXT.test(text)) return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : null;
}

/** True for "1,35" and "1.234,5": numbers written with a decimal comma. */
export function looksLikeDecimalComma(text: string): boolean {
  return /^[+-]?\d{1,3}(?:\.\d{3})*,\d+$/.test(text) || /^[+-]?\d+,\d+$/.test(text);
}

/** The version line: this code reads only version 1 and says so. */
export function checkVersion(section: HeaderSection, problems: ProblemList): void {
  const entry = section.entries.get(HEADER_KEYS.version);
  if (!entry) return;
  if (entry.value !== String(MAP_FORMAT_VERSION)) {
    problems.add(
      'wrong-version',
      entry.line,
      null,
      `this file says "spoolbook-map: ${entry.value}"; this Spoolbook reads version ${MAP_FORMAT_VERSION} map files only`,
    );
  }
}

export function readKind(section: HeaderSection, problems: ProblemList): MapKind | null {
  const entry = section.entries.get(HEADER_KEYS.kind);
  if (!entry) return null;
  const kind = entry.value.toLowerCase();
  if ((MAP_KINDS as readonly string[]).includes(kind)) return kind as MapKind;
  problems.add('unknown-kind', entry.line, null, `kind ${quoteCell(entry.value)} is not one Spoolbook knows; use "compressor" or "turbine"`);
  return null;
}

/** Checks a name; returns the problem in words, or null when it is fine. Shared with the metadata schema. */
export function nameProblem(name: string): string | null {
  if (name === '') return 'the name is empty';
  if (name.length > MAX_MAP_NAME_LENGTH) return `the name is ${name.length} characters long; the limit is ${MAX_MAP_NAME_LENGTH}`;
  if (FORMULA_START.test(name)) return 'the name starts with =, +, -, @ or a tab, which a spreadsheet would run as a formula; start it with a letter or digit';
  return null;
}

function readName(section: HeaderSection, problems: ProblemList): string | null {
  const entry = section.entries.get(HEADER_KEYS.name);
  if (!entry) return null;
  const problem = nameProblem(entry.value);
  if (problem === null) return entry.value;
  problems.add(problem.includes('formula') ? 'formula-cell' : 'bad-value', entry.line, null, problem);
  return null;
}

function readNotes(section: HeaderSection, problems: ProblemList): string[] {
  const notes = section.notes.map((n) => n.value);
  const length = notes.join('\n').length;
  if (length > MAX_NOTES_LENGTH) {
    problems.add('out-of-range', section.notes[0].line, null, `the notes are ${length} characters long; the limit is ${MAX_NOTES_LENGTH}`);
  }
  return notes;
}

function readEfficiencyScale(section: HeaderSection, problems: ProblemList): EfficiencyScale | null {
  const entry = section.entries.get(HEADER_KEYS.efficiency);
  if (!entry) return null;
  const scale = entry.value.toLowerCase();
  if ((EFFICIENCY_SCALES as readonly string[]).includes(scale)) return scale as EfficiencyScale;
  problems.add('bad-value', entry.line, null, `efficiency ${quoteCell(entry.value)} is not a scale Spoolbook knows; write "percent" or "fraction"`);
  return null;
}

/** Reads a unit-only header value such as `speed: krpm`. */
export function readUnitValue(entry: HeaderEntry, kind: MapQuantity, problems: ProblemList): string | null {
  if (entry.value === '') {
    problems.add('missing-unit', entry.line, null, `"${entry.key}" needs a unit`);
    return null;
  }
  const reading = readUnit(entry.value, kind);
  if (reading.ok) return reading.unit;
  problems.add(reading.reason, entry.line, null, `${entry.key}: ${reading.message}`);
  return null;
}

function readSpeedUnit(section: HeaderSection, problems: ProblemList): string {
  const entry = section.entries.get(HEADER_KEYS.speed);
  if (!entry) return 'rpm';
  return readUnitValue(entry, 'speed', problems) ?? 'rpm';
}

/** A header value that is a number and a unit, such as `545 degR`, in SI and with its unit text. */
export interface Quantity {
  si: number;
  unit: string;
}

/** Reads a `<number> <unit>` header value; `example` is shown when the value is malformed. */
export function readQuantity(entry: HeaderEntry, kind: MapQuantity, example: string, problems: ProblemList): Quantity | null {
  const match = /^([+-]?\d[\d.,]*(?:[eE][+-]?\d+)?|[+-]?\.\d+)\s*(.*)$/.exec(entry.value);
  const numberText = match?.[1] ?? '';
  const unitText = (match?.[2] ?? '').trim();
  const value = parseDecimal(numberText);
  if (value === null) {
    if (looksLikeDecimalComma(numberText)) {
      problems.add(
        'decimal-comma',
        entry.line,
        null,
        `${entry.key}: "${numberText}" uses a decimal comma; write it with a decimal point (${numberText.replace(',', '.')})`,
      );
    } else {
      problems.add('bad-value', entry.line, null, `${entry.key} must be a number and a unit, such as "${example}" (found ${quoteCell(entry.value)})`);
    }
    return null;
  }
  if (unitText === '') {
    problems.add('missing-unit', entry.line, null, `${entry.key} needs a unit after the number, such as "${example}"`);
    return null;
  }
  const reading = readUnit(unitText, kind);
  if (!reading.ok) {
    problems.add(reading.reason, entry.line, null, `${entry.key}: ${reading.message}`);
    return null;
  }
  return { si: mapValueToSI(value, reading.unit, kind), unit: reading.unit };
}

export function readCommonHeader(section: HeaderSection, problems: ProblemList): CommonHeader {
  checkVersion(section, problems);
  return {
    kind: readKind(section, problems),
    name: readName(section, problems),
    notes: readNotes(section, problems),
    efficiency: readEfficiencyScale(section, problems),
    speedUnit: readSpeedUnit(section, problems),
  };
}

/** Reports required keys that are absent and keys that belong to the other kind of map. */
export function checkKeysForKind(
  section: HeaderSection,
  kind: MapKind,
  required: readonly string[],
  optional: readonly string[],
  examples: Record<string, string>,
  problems: ProblemList,
): void {
  for (const key of required) {
    if (!section.entries.has(key)) {
      const example = examples[key] ? `, for example "# ${key}: ${examples[key]}"` : '';
      problems.add('missing-key', null, null, `header key "${key}" is missing${example}`);
    }
  }
  for (const entry of section.entries.values()) {
    if (!required.includes(entry.key) && !optional.includes(entry.key)) {
      problems.add('misplaced-key', entry.line, null, `header key "${entry.key}" does not belong in a ${kind} map file`);
    }
  }
}
