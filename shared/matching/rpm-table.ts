import { MAX_RPM_POINTS, rpmPointCount, type RpmPoints, type RpmTable } from './input/rpm';

/** Where a table lookup landed: between two rows, or held at the first or last row. */
export interface RpmLookup {
  value: number;
  /** Rows used: one when held flat or exact, two when interpolating. */
  lower: { rpm: number; value: number };
  upper: { rpm: number; value: number };
  held: 'below' | 'above' | null;
}

/** Value of a table at an rpm: linear between rows, flat outside them (the Working says which). */
export function lookupByRpm(table: RpmTable, rpm: number): RpmLookup {
  const first = table[0];
  const last = table[table.length - 1];
  if (rpm <= first.rpm) return { value: first.value, lower: first, upper: first, held: rpm < first.rpm ? 'below' : null };
  if (rpm >= last.rpm) return { value: last.value, lower: last, upper: last, held: rpm > last.rpm ? 'above' : null };
  let i = 1;
  while (table[i].rpm < rpm) i++;
  const lower = table[i - 1];
  const upper = table[i];
  if (upper.rpm === rpm) return { value: upper.value, lower: upper, upper, held: null };
  const t = (rpm - lower.rpm) / (upper.rpm - lower.rpm);
  return { value: lower.value + (upper.value - lower.value) * t, lower, upper, held: null };
}

/** Just the value of a table at an rpm. */
export function valueAtRpm(table: RpmTable, rpm: number): number {
  return lookupByRpm(table, rpm).value;
}

/** The engine speeds, rpm, of an rpm list or range; a range includes max when the steps land on it. */
export function rpmPointsOf(points: RpmPoints): number[] {
  if (points.kind === 'list') return points.values.slice();
  const out: number[] = [];
  const { min, step } = points;
  // Count first so rounding in min + k·step never adds or drops the end point.
  const count = rpmPointCount(points);
  for (let k = 0; k < count && k < MAX_RPM_POINTS; k++) out.push(min + k * step);
  return out;
}
