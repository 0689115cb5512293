/** Readings over a study result that the Candidates ranking sums up: worst values with where, and values at one speed. */
import type { OperatingLine, PointValues } from '../matching/result';
import { reasonText, type Verdict } from '../matching/verdict';
import type { CandidateVerdict, ValueAtSpeed, ValueWhere } from './types';

/** The smallest (or largest) value of `pick` over every solved point of the lines, with where it was found. */
export function extremeWhere(lines: readonly OperatingLine[], pick: (v: PointValues) => number | null | undefined, which: 'least' | 'most'): ValueWhere | null {
  let best: ValueWhere | null = null;
  for (const line of lines) {
    for (const point of line.points) {
      if (!point.values) continue;
      const value = pick(point.values);
      if (value == null || !Number.isFinite(value)) continue;
      if (best === null || (which === 'least' ? value < best.value : value > best.value)) {
        best = { value, scenarioName: line.scenarioName, rowLabel: line.rowLabel, rpm: point.rpm };
      }
    }
  }
  return best;
}

/** The value of `pick` at one engine speed of a line (null where the point is unsolved or has no value). */
export function valueAtSpeed(line: OperatingLine | undefined, rpm: number, pick: (v: PointValues) => number | null | undefined): ValueAtSpeed {
  const point = line?.points.find((p) => p.rpm === rpm);
  const value = point?.values ? pick(point.values) : null;
  return { rpm, value: value ?? null };
}

/**
 * The reference line of a study: the first full-load row of the first scenario that has one (the
 * line a builder reads peak torque and power from), else the first line.
 */
export function referenceLine(lines: readonly OperatingLine[]): OperatingLine | undefined {
  return lines.find((l) => l.rowKind === 'full-load') ?? lines[0];
}

/** Engine speeds of peak torque and peak power of a line, rpm (null when no point has them). */
export function peakSpeeds(line: OperatingLine | undefined): { torque: number | null; power: number | null } {
  let torque: { rpm: number; value: number } | null = null;
  let power: { rpm: number; value: number } | null = null;
  for (const p of line?.points ?? []) {
    const t = p.values?.torque;
    const w = p.values?.brakePower;
    if (t != null && (torque === null || t > torque.value)) torque = { rpm: p.rpm, value: t };
    if (w != null && (power === null || w > power.value)) power = { rpm: p.rpm, value: w };
  }
  return { torque: torque?.rpm ?? null, power: power?.rpm ?? null };
}

/** A verdict as a candidate row shows it. */
export function candidateVerdict(v: Verdict): CandidateVerdict {
  const first = v.reasons[0] ?? null;
  return {
    status: v.status,
    headline: v.headline,
    firstReason: first ? reasonText(first) : null,
    firstReasonDetail: first,
    pointsAtLimit: v.pointsAtLimit,
    pointsWithWarnings: v.pointsWithWarnings,
  };
}
