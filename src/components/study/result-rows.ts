import { worstSeverity } from '#shared/matching/finding';
import { missingMarginWords, type MarginName } from '#shared/matching/compressor/margin-words';
import { RESULT_KEYS } from '#shared/matching/compressor/reach';
import { mapRegionText, reachableText, RESULT_COLUMNS, type ResultColumn } from '#shared/matching/results-table';
import type { PointValues } from '#shared/matching/result';
import type { Severity } from '#shared/matching/finding';
import type { StudyLine } from './lines';
import { inputText, quantityUnit, type StudyQuantity, type UnitSystem } from '#src/lib/quantities';

/** One row of the results table: one operating point. */
export interface ResultTableRow {
  /** `${lineKey}@${rpm}`. */
  id: string;
  lineKey: string;
  planIndex: number;
  plan: string;
  scenario: string;
  row: string;
  rpm: number;
  values: PointValues | null;
  findingCount: number;
  severity: Severity | null;
  findings: string;
  /** Where the point sits, in words ("past choke", "no map"). */
  region: string;
  /** "yes" where the point's results stand, "no" where the compressor cannot deliver it. */
  reachable: 'yes' | 'no';
  /** The line computes the exhaust side (so its exhaust columns would have values). */
  withExhaust: boolean;
}

export function resultTableRows(lines: readonly StudyLine[]): ResultTableRow[] {
  const order = { limit: 0, warning: 1, info: 2 } as const;
  return lines.flatMap((l) =>
    l.line.points.map((p) => ({
      id: `${l.key}@${p.rpm}`,
      lineKey: l.key,
      planIndex: l.planIndex,
      plan: l.line.planName,
      scenario: l.line.scenarioName,
      row: l.line.rowLabel,
      rpm: p.rpm,
      values: p.values,
      findingCount: p.findings.length,
      severity: worstSeverity(p.findings),
      findings: [...p.findings]
        .sort((a, b) => order[a.severity] - order[b.severity])
        .map((f) => `${f.severity}: ${f.message}`)
        .join('; '),
      region: mapRegionText(p.values),
      reachable: reachableText(p.values),
      withExhaust: Boolean(l.line.context.exhaust?.turbine),
    })),
  );
}

/** The words a result cell shows in place of a value the compressor cannot deliver. */
export const NOT_REACHABLE = 'not reachable';

const CLEARED = new Set<string>(RESULT_KEYS);
// The exhaust columns close RESULT_COLUMNS; they have values only on lines with the exhaust side.
const EXHAUST_COLUMNS = new Set(RESULT_COLUMNS.slice(RESULT_COLUMNS.findIndex((c) => c.key === 'exhaustMassFlow')).map((c) => c.key));
const MARGINS: Partial<Record<keyof PointValues, MarginName>> = { surgeMargin: 'surge', chokeMargin: 'choke', speedMargin: 'speed' };

/**
 * What an empty cell means: "not reachable" for a result of a point the compressor cannot deliver,
 * and for a missing margin why the map cannot give it; null for a value that is there or that
 * simply does not apply (e.g. the exhaust side of a plan without one).
 */
export function emptyCellNote(row: ResultTableRow, column: ResultColumn): { text: string; why?: string } | null {
  const v = row.values;
  if (!v || typeof v[column.key] === 'number') return null;
  if (row.reachable === 'no' && CLEARED.has(column.key) && (row.withExhaust || !EXHAUST_COLUMNS.has(column.key))) {
    return { text: NOT_REACHABLE, why: `Not reachable with this compressor (${row.region}): no result is given here.` };
  }
  const margin = MARGINS[column.key];
  const why = margin ? missingMarginWords(v, margin) : null;
  return why ? { text: '—', why: `No ${margin} margin: ${why}.` } : null;
}

/** The quantity a result column is shown as (fuel flows in L/h or gal/h, boost labelled gauge). */
export function columnQuantity(column: ResultColumn): StudyQuantity {
  if (column.key === 'fuelVolumeFlow' || column.key === 'pumpFlowRequired') return 'fuelFlow';
  if (column.gauge) return 'pressureGauge';
  if (column.key === 'wastegateDiameterNeeded') return 'diameter';
  switch (column.kind) {
    case 'none':
      return 'ratio';
    default:
      return column.kind;
  }
}

/** The unit written under a column's name: "kPa gauge", "%", "–" for plain numbers. */
export function columnUnit(column: ResultColumn, system: UnitSystem): string {
  return quantityUnit(columnQuantity(column), system).label || '–';
}

/** A cell's value in the shown unit, or null. */
export function cellValue(row: ResultTableRow, column: ResultColumn, system: UnitSystem): number | null {
  const v = row.values?.[column.key];
  if (typeof v !== 'number' || !Number.isFinite(v)) return null;
  return quantityUnit(columnQuantity(column), system).fromSI(v);
}

/**
 * The rows as tab-separated text for a spreadsheet: one header line with units, numbers in the
 * user's units without grouping (so a spreadsheet reads them as numbers), empty cells for values
 * that do not apply.
 */
export function resultsTsv(rows: readonly ResultTableRow[], system: UnitSystem, columns: readonly ResultColumn[] = RESULT_COLUMNS): string {
  // Text cells that a spreadsheet would run as a formula get a leading apostrophe (OWASP CSV injection).
  const clean = (text: string) => {
    const one = text.replace(/[\t\r\n]+/g, ' ');
    return /^[=+\-@]/.test(one) ? `'${one}` : one;
  };
  // Map region and reachable close the line, as in the CSV export, so the earlier columns keep their places.
  const head = ['Plan', 'Scenario', 'Boost row', ...columns.map((c) => `${c.label} (${columnUnit(c, system)})`), 'Findings', 'Map region', 'Reachable'];
  const lines = rows.map((r) => [
    clean(r.plan),
    clean(r.scenario),
    clean(r.row),
    ...columns.map((c) => {
      const v = cellValue(r, c, system);
      return v === null ? '' : inputText(v, 6);
    }),
    clean(r.findings),
    r.region,
    r.reachable,
  ]);
  return [head, ...lines].map((cells) => cells.join('\t')).join('\n');
}
