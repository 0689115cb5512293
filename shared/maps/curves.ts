import type { EfficiencyScale } from './format';
import { quoteCell, type ProblemList } from './problems';
import type { DataRow } from './rows';
import type { MapProblem } from './types';

/** The rows of one polyline, in file order. */
export interface RowGroup {
  curve: string;
  label: string;
  rows: DataRow[];
  /** A second polyline under a label already used: reported once, then left out of other checks. */
  duplicate: boolean;
}

const CURVE_WORDS: Record<string, string> = {
  surge: 'surge line',
  choke: 'choke line',
  speed: 'speed line',
  island: 'efficiency island',
  flow: 'flow line',
};

/** How a polyline is named in messages: `speed line "60000"`. */
export function curveName(group: { curve: string; label: string }): string {
  const words = CURVE_WORDS[group.curve] ?? group.curve;
  return group.label === '' ? words : `${words} ${quoteCell(group.label)}`;
}

function lineSpan(rows: DataRow[]): string {
  const first = rows[0].line;
  const last = rows[rows.length - 1].line;
  return first === last ? `line ${first}` : `lines ${first}–${last}`;
}

/**
 * Groups rows into polylines by curve kind and label. Rows of one polyline must be together:
 * a label that comes back after another polyline is a duplicate, and surge and choke lines are
 * one each, so that a typo in a label never silently splits or merges lines.
 */
export function groupRows(rows: DataRow[], singleCurves: readonly string[], problems: ProblemList): RowGroup[] {
  const groups: RowGroup[] = [];
  const seen = new Map<string, RowGroup>();
  const firstOfCurve = new Map<string, RowGroup>();
  let current: RowGroup | null = null;
  for (const row of rows) {
    if (current && current.curve === row.curve && current.label === row.label) {
      current.rows.push(row);
      continue;
    }
    const key = `${row.curve}\u0001${row.label}`;
    const earlier = seen.get(key);
    const single = singleCurves.includes(row.curve) && firstOfCurve.has(row.curve);
    if (earlier) {
      problems.add(
        'duplicate-label',
        row.line,
        2,
        `${curveName(row)} appears again here, apart from its first rows (${lineSpan(earlier.rows)}); keep each line's rows together and give every line its own label`,
      );
    } else if (single) {
      const first = firstOfCurve.get(row.curve)!;
      problems.add(
        'duplicate-label',
        row.line,
        2,
        `a map has one ${CURVE_WORDS[row.curve]}; this row starts a second one (label ${quoteCell(row.label)}; the first starts on line ${first.rows[0].line})`,
      );
    }
    current = { curve: row.curve, label: row.label, rows: [row], duplicate: earlier !== undefined || single };
    groups.push(current);
    if (!earlier) seen.set(key, current);
    if (!firstOfCurve.has(row.curve)) firstOfCurve.set(row.curve, current);
  }
  return groups;
}

/**
 * A whole column on the wrong scale (every efficiency above 1 in a fraction file, or at most 1 in a
 * percent file) is one slip in the header, reported once on the header line instead of on every row.
 * Returns true when it reported one.
 */
export function checkEfficiencyScale(rows: DataRow[], scale: EfficiencyScale | null, headerLine: number | null, problems: ProblemList): boolean {
  if (scale === null || headerLine === null) return false;
  const values = rows.map((r) => r.values[2]).filter((e): e is number => e !== null);
  if (values.length === 0) return false;
  if (scale === 'percent' && values.every((e) => e > 0 && e <= 1)) {
    problems.add(
      'efficiency-scale',
      headerLine,
      null,
      'the header says efficiency is in percent, but every efficiency is at most 1; write "# efficiency: fraction" or give percent values',
    );
    return true;
  }
  if (scale === 'fraction' && values.every((e) => e > 1 && e <= 100)) {
    problems.add(
      'efficiency-scale',
      headerLine,
      null,
      'the header says efficiency is a fraction, but every efficiency is above 1; write "# efficiency: percent" or give fractions',
    );
    return true;
  }
  return false;
}

/** Checks an efficiency cell against the file's scale; returns false when it is out of range. */
export function checkEfficiency(value: number, scale: EfficiencyScale, line: number, problems: ProblemList): boolean {
  const top = scale === 'percent' ? 100 : 1;
  if (value > 0 && value <= top) return true;
  const hint = scale === 'fraction' && value > 1 && value <= 100 ? ' (the header says fraction; write "# efficiency: percent" if the file is in percent)' : '';
  problems.add('efficiency-out-of-range', line, 5, `efficiency ${value} is outside 0..${top} (${scale}); it must be above 0 and at most ${top}${hint}`);
  return false;
}

/** A value that must be the same on every row of a line (a speed line's speed, an island's efficiency). */
export function checkSameAlongLine(group: RowGroup, column: number, columnName: string, problems: ProblemList): void {
  const index = column - 3;
  const firstRow = group.rows.find((r) => r.values[index] !== null);
  if (!firstRow) return;
  const first = firstRow.values[index];
  for (const row of group.rows) {
    const value = row.values[index];
    if (value !== null && value !== first) {
      problems.add(
        'inconsistent-line',
        row.line,
        column,
        `${curveName(group)} has ${columnName} ${value} here but ${first} on line ${firstRow.line}; one line has one ${columnName}`,
      );
    }
  }
}

/** Values in a column that must rise from row to row along a line. */
export function checkIncreasing(group: RowGroup, column: number, columnName: string, advice: string, problems: ProblemList): void {
  const index = column - 3;
  for (let i = 1; i < group.rows.length; i++) {
    const before = group.rows[i - 1].values[index];
    const here = group.rows[i].values[index];
    if (before !== null && here !== null && !(here > before)) {
      problems.add(
        'not-increasing',
        group.rows[i].line,
        column,
        `${columnName} must increase along ${curveName(group)}: ${here} here follows ${before} on line ${group.rows[i - 1].line}; ${advice}`,
      );
    }
  }
}

export function checkPointCount(group: RowGroup, minimum: number, problems: ProblemList): boolean {
  if (group.rows.length >= minimum) return true;
  const count = group.rows.length === 1 ? 'one point' : `${group.rows.length} points`;
  problems.add('too-few-points', group.rows[0].line, null, `${curveName(group)} has ${count}; a line needs at least ${minimum}`);
  return false;
}

/** Distinct speeds for distinct lines: two labels at one speed are almost always a typo. */
export function checkDistinctSpeeds(groups: RowGroup[], problems: ProblemList): void {
  const bySpeed = new Map<number, RowGroup>();
  for (const group of groups) {
    if (group.duplicate) continue;
    const speed = group.rows.find((r) => r.values[3] !== null)?.values[3];
    if (speed === undefined || speed === null) continue;
    const other = bySpeed.get(speed);
    if (other) {
      problems.add(
        'duplicate-label',
        group.rows[0].line,
        6,
        `${curveName(group)} and ${curveName(other)} (line ${other.rows[0].line}) both run at speed ${speed}; give each speed one line`,
      );
    } else {
      bySpeed.set(speed, group);
    }
  }
}

/**
 * An island must be a closed contour. One left open is closed here by repeating its first point,
 * with a note, because digitising tools often stop one click short; written back, it is closed.
 */
export function closeIsland(group: RowGroup, notes: MapProblem[]): DataRow[] {
  const first = group.rows[0];
  const last = group.rows[group.rows.length - 1];
  if (first.values[0] === last.values[0] && first.values[1] === last.values[1]) return group.rows;
  notes.push({
    code: 'island-not-closed',
    line: last.line,
    column: null,
    message: `${curveName(group)} was not closed; Spoolbook closed it by joining its last point (line ${last.line}) to its first (line ${first.line})`,
  });
  return [...group.rows, { ...first }];
}

export function distinctPointCount(rows: DataRow[]): number {
  return new Set(rows.map((r) => `${r.values[0]},${r.values[1]}`)).size;
}
