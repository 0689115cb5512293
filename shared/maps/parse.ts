import { COMPRESSOR_COLUMNS, COMPRESSOR_CURVE_KINDS, MAX_MAP_DATA_ROWS, TURBINE_COLUMNS, TURBINE_CURVE_KINDS, type MapKind } from './format';
import { decodeMapInput } from './decode';
import { isBlankLine, looksLikeDecimalComma, readCommonHeader, readHeaderSection } from './header';
import { readCompressor } from './parse-compressor';
import { readTurbine } from './parse-turbine';
import { ProblemList } from './problems';
import { otherDelimiter, readDataRows, splitCsvLine } from './rows';
import type { MapParseResult, MapProblem } from './types';

const COLUMNS: Record<MapKind, readonly string[]> = { compressor: COMPRESSOR_COLUMNS, turbine: TURBINE_COLUMNS };
const CURVES: Record<MapKind, readonly string[]> = { compressor: COMPRESSOR_CURVE_KINDS, turbine: TURBINE_CURVE_KINDS };

function refuse(problems: ProblemList): MapParseResult {
  return { ok: false, problems: problems.sorted() };
}

function columnNames(line: string): string[] {
  const cells = splitCsvLine(line).map((c) => c.trim().toLowerCase());
  while (cells.length > 0 && cells[cells.length - 1] === '') cells.pop();
  return cells;
}

function kindOfColumns(names: string[]): MapKind | null {
  const joined = names.join(',');
  if (joined === COMPRESSOR_COLUMNS.join(',')) return 'compressor';
  if (joined === TURBINE_COLUMNS.join(',')) return 'turbine';
  return null;
}

/** The first decimal comma in the data of a file with another delimiter, for one plain hint. */
function firstDecimalCommaLine(lines: string[], from: number): number | null {
  for (let i = from; i < lines.length; i++) {
    if (lines[i].split(/[;\t|]/).some((cell) => looksLikeDecimalComma(cell.trim()))) return i + 1;
  }
  return null;
}

/**
 * Reads a Spoolbook map file (the bytes of an upload or its text) into a map in SI units, or
 * refuses it whole with every problem placed by line and column. Nothing here throws on bad input.
 */
export function parseMapFile(input: string | Uint8Array): MapParseResult {
  const problems = new ProblemList();
  const text = decodeMapInput(input, problems);
  if (text === null) return refuse(problems);

  const lines = text.split(/\r\n|\r|\n/);
  while (lines.length > 0 && isBlankLine(lines[lines.length - 1])) lines.pop();
  const section = readHeaderSection(lines, problems);
  const hasHeader = section.entries.size > 0 || section.notes.length > 0;
  const columnIndex = section.columnLineIndex;

  if (columnIndex >= lines.length) {
    problems.add('bad-columns', null, null, 'the file ends after its header lines: the column names and the data rows are missing');
    return refuse(problems);
  }
  const columnLine = lines[columnIndex];
  const names = columnNames(columnLine);
  const columnsKind = kindOfColumns(names);
  if (!hasHeader && columnsKind === null) {
    const found = new ProblemList();
    found.add(
      'not-a-map-file',
      columnIndex + 1,
      null,
      'this is not a Spoolbook map file: a map file begins with "# spoolbook-map: 1" and other "# key: value" lines, then the column names, then one CSV row per point',
    );
    return refuse(found);
  }

  const common = readCommonHeader(section, problems);
  const delimiter = otherDelimiter(columnLine);
  if (delimiter) {
    problems.add(
      'wrong-delimiter',
      columnIndex + 1,
      null,
      `the columns are separated by ${delimiter}; Spoolbook map files separate them with commas (save as "CSV UTF-8, comma-separated")`,
    );
    const commaLine = firstDecimalCommaLine(lines, columnIndex + 1);
    if (commaLine !== null) {
      problems.add('decimal-comma', commaLine, null, 'numbers here use decimal commas (1,35); write them with a decimal point (1.35)');
    }
    return refuse(problems);
  }

  const kind = common.kind ?? columnsKind;
  if (kind === null) {
    if (!section.entries.has('kind')) problems.add('missing-key', null, null, 'header key "kind" is missing, for example "# kind: compressor"');
    problems.add(
      'bad-columns',
      columnIndex + 1,
      null,
      `the column names must be "${COMPRESSOR_COLUMNS.join(',')}" for a compressor map or "${TURBINE_COLUMNS.join(',')}" for a turbine map`,
    );
    return refuse(problems);
  }
  if (names.join(',') !== COLUMNS[kind].join(',')) {
    problems.add(
      'bad-columns',
      columnIndex + 1,
      null,
      `the column names of a ${kind} map are "${COLUMNS[kind].join(',')}", in this order (found "${names.join(',').slice(0, 120)}")`,
    );
    return refuse(problems);
  }

  const firstDataIndex = columnIndex + 1;
  let dataRowCount = 0;
  for (let i = firstDataIndex; i < lines.length; i++) if (!isBlankLine(lines[i])) dataRowCount++;
  if (dataRowCount === 0) {
    problems.add('no-data-rows', null, null, 'the file has no data rows: after the column names, give one row per point');
    return refuse(problems);
  }
  if (dataRowCount > MAX_MAP_DATA_ROWS) {
    problems.add(
      'too-many-rows',
      null,
      null,
      `the file has ${dataRowCount.toLocaleString('en-US')} data rows; the limit is ${MAX_MAP_DATA_ROWS.toLocaleString('en-US')}`,
    );
    return refuse(problems);
  }

  const read = readDataRows(lines, firstDataIndex, COLUMNS[kind], CURVES[kind], problems);
  const rows = read.complete ? read.rows : [];
  const notes: MapProblem[] = [];
  const map = kind === 'compressor' ? readCompressor(section, common, rows, problems, notes) : readTurbine(section, common, rows, problems);
  if (!problems.isEmpty) return refuse(problems);
  if (map === null) {
    // Every path that yields no map records why; this guards the contract if one ever does not.
    problems.add('bad-value', null, null, 'the file could not be read as a map');
    return refuse(problems);
  }
  return { ok: true, map, notes };
}
