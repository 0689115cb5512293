import { worstSeverity } from '../../../shared/matching/findings';
import { RESULT_COLUMNS, type ResultColumn } from '../../../shared/matching/results-table';
import type { PointValues, Severity } from '../../../shared/matching/types';
import type { UnitSystem } from '../../lib/units';
import type { StudyLine } from './lines';
import { inputText, quantityUnit, type StudyQuantity } from './units';

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
    })),
  );
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
  const head = ['Plan', 'Scenario', 'Boost row', ...columns.map((c) => `${c.label} (${columnUnit(c, system)})`), 'Findings'];
  const lines = rows.map((r) => [
    clean(r.plan),
    clean(r.scenario),
    clean(r.row),
    ...columns.map((c) => {
      const v = cellValue(r, c, system);
      return v === null ? '' : inputText(v, 6);
    }),
    clean(r.findings),
  ]);
  return [head, ...lines].map((cells) => cells.join('\t')).join('\n');
}
