import Papa from 'papaparse';

/**
 * The one CSV writer for every CSV Spoolbook serves (map files, study results, any export).
 *
 * A text cell that begins with `=`, `+`, `-`, `@`, a tab or a carriage return (or NUL) is run as a
 * formula by spreadsheets (OWASP "CSV Injection"; OWASP ASVS 5.0 1.2.10): such a cell is written
 * with a leading apostrophe, inside quotes. Numbers stay numbers: `-1.5` as a number is written as
 * it is, the same text as a string is neutralised.
 */
export const FORMULA_START = /^[=+\-@\t\r\0]/;

export type CsvCell = string | number | boolean | null | undefined;

const options = (newline: string) => ({ escapeFormulae: FORMULA_START, newline, quotes: false });

/** A table: the column names, then one line per row. No line break after the last row. */
export function writeCsv(fields: readonly string[], rows: ReadonlyArray<ReadonlyArray<CsvCell>>, newline = '\r\n'): string {
  return Papa.unparse({ fields: [...fields], data: rows.map((r) => [...r]) }, options(newline));
}

/**
 * One line that must stay one cell: a `# key: value` line of a map file. A spreadsheet splits a
 * line at its commas; when a piece would start a formula (leading spaces aside), or the line holds
 * a quote or a line break (or ends in a comma), the whole line is quoted so it stays one cell. Other lines are written
 * as they are, so `# flow: corrected mass, kg/s` reads as the format shows it.
 */
export function csvLine(text: string): string {
  // A line ending in commas would read back as a spreadsheet's padding: quote it too.
  const risky =
    /["\r\n]/.test(text) || /,\s*$/.test(text) || text.split(',').some((piece) => FORMULA_START.test(piece.trimStart()) || FORMULA_START.test(piece));
  return risky ? Papa.unparse([[text]], { ...options('\n'), quotes: true }) : text;
}
