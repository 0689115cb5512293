import type { CompareCell, CompareRow, CompareRowKey } from '#shared/study/compare';
import { VerdictStamp } from '#src/components/study/PlanVerdicts';
import { CombinationMark, type ChosenLine } from './CombinationMark';
import { formatNumber, quantityUnit, type StudyQuantity, type UnitSystem, useUnitSystem } from '#src/lib/quantities';

const QUANTITY: Record<string, StudyQuantity> = {
  fraction: 'fraction',
  speed: 'speed',
  power: 'power',
  torque: 'torque',
  temperature: 'temperature',
  ratio: 'ratio',
  count: 'count',
  // Turbine inlet pressure is absolute (physics note §5: p3); the unit text says so.
  pressure: 'pressure',
};

/** Rows whose quantity is not the plain one of their kind: wastegate valves are small diameters (mm or in). */
const ROW_QUANTITY: Partial<Record<CompareRowKey, StudyQuantity>> = {
  wastegateDiameterNeeded: 'diameter',
  wastegateDiameterFitted: 'diameter',
};

/** Words for the ratio rows (symbols of the physics note: p₁ compressor inlet, p₂ outlet, p₃ turbine inlet, p_man intake manifold). */
const RATIO_UNIT: Partial<Record<CompareRowKey, { unit: string; words: string }>> = {
  peakPressureRatio: { unit: 'p₂/p₁ (ratio)', words: 'compressor outlet over inlet' },
  peakDrivePressureRatio: { unit: 'p₃/p_man (ratio)', words: 'exhaust over intake manifold' },
};

/** The drive rows' units: seconds and metres in both systems (they are read as times and lengths of road). */
const DRIVE_UNIT: Partial<Record<CompareRowKey, string>> = { timeToBoost: 's', runTime: 's', runDistance: 'm' };

function quantityOf(row: CompareRow): StudyQuantity {
  return ROW_QUANTITY[row.key] ?? QUANTITY[row.kind] ?? 'ratio';
}

/** The unit a row is read in: the user's unit, or words for plain numbers. */
export function rowUnit(row: CompareRow, system: UnitSystem): string {
  if (row.key === 'planVerdict') return '';
  if (DRIVE_UNIT[row.key]) return DRIVE_UNIT[row.key]!;
  if (row.kind === 'ratio') return RATIO_UNIT[row.key]?.unit ?? 'p₂/p₁ (ratio)';
  if (row.kind === 'count') return 'count';
  const label = quantityUnit(quantityOf(row), system).label;
  return row.kind === 'pressure' ? `${label} abs.` : label;
}

/** Plain words under a row's unit where the symbols alone would not say what is over what; null for most rows. */
export function rowUnitWords(row: CompareRow): string | null {
  return row.kind === 'ratio' ? (RATIO_UNIT[row.key]?.words ?? null) : null;
}

/** Why a cell is empty, in a few words; null when the cell has a value or is a count. */
export function emptyCellWords(row: CompareRow, cell: CompareCell): string | null {
  if (cell.value !== null || row.kind === 'count' || row.key === 'planVerdict') return null;
  if (cell.note === 'not-reached') return 'not reached';
  if (cell.note === 'no-exhaust') return 'no exhaust side';
  if (cell.note === 'no-boost-asked') return 'no boost asked';
  if (cell.note === 'unknown') return 'unknown (see Drive)';
  return /margin|shaft/i.test(row.label) ? 'no map' : 'not computed';
}

/** A cell's number in the row's unit; speeds and counts whole. */
export function rowValueText(row: CompareRow, value: number | null, system: UnitSystem): string {
  if (value === null) return '—';
  if (row.kind === 'count') return formatNumber(value, 21);
  if (DRIVE_UNIT[row.key]) return formatNumber(value, 3);
  const shown = quantityUnit(quantityOf(row), system).fromSI(value);
  return row.kind === 'speed' ? formatNumber(Math.round(shown), 21) : formatNumber(shown, 4);
}

const BEST_WORDS = { highest: 'Highest', lowest: 'Lowest', none: '—' } as const;

/**
 * Whether a cell is shown "past a limit": a value found where a limit is crossed (a negative
 * margin, a point at a limit). Every cell of a plan that does not fit is left out of best as well,
 * but says so once, in the verdict row, not in every cell.
 */
export function pastLimitMark(row: CompareRow, cell: CompareCell, chosen: ChosenLine | undefined): boolean {
  if (!cell.excluded || cell.value === null || row.key === 'planVerdict') return false;
  if (chosen?.verdict?.status !== 'does-not-fit') return true;
  return row.kind === 'fraction' && /margin/i.test(row.key) && cell.value < 0;
}

/** One row per figure, one column per chosen line, the best of each row marked. */
export function DifferencesTable({ rows, chosen }: { rows: readonly CompareRow[]; chosen: readonly ChosenLine[] }) {
  const system = useUnitSystem();
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[40rem] border-collapse text-left text-sm" data-testid="differences-table">
        <caption className="sr-only">
          Differences between the chosen lines, what fits first: one row per figure, the best value of each row marked among plans that fit.
        </caption>
        <thead className="border-b-2 border-ink/20 align-bottom text-xs text-ink-soft">
          <tr>
            <th scope="col" className="px-2 py-2 font-semibold uppercase tracking-wider">
              Figure
            </th>
            <th scope="col" className="px-2 py-2 font-semibold uppercase tracking-wider">
              Unit
            </th>
            <th scope="col" className="px-2 py-2 font-semibold uppercase tracking-wider">
              Best is
            </th>
            {chosen.map((c) => (
              <th key={c.key} scope="col" className="min-w-[9rem] px-2 py-2 text-right font-semibold normal-case text-ink">
                <span className="flex items-start justify-end gap-1.5">
                  <CombinationMark index={c.index} />
                  <span>
                    <span className="block">{c.planName}</span>
                    <span className="block font-normal text-ink-soft">
                      {c.scenarioName} · {c.rowLabel}
                    </span>
                  </span>
                </span>
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-paper-line">
          {rows.map((row) => (
            <tr key={row.key} data-row={row.key}>
              <th scope="row" className="px-2 py-2 font-semibold text-ink">
                {row.label}
              </th>
              <td className="px-2 py-2 text-ink-soft">
                <span className="whitespace-nowrap">{rowUnit(row, system)}</span>
                {rowUnitWords(row) !== null && <span className="block text-xs">{rowUnitWords(row)}</span>}
              </td>
              <td className="px-2 py-2 text-xs text-ink-soft" title={row.bestMeaning}>
                <span className="font-semibold text-ink">{BEST_WORDS[row.best]}</span>
                {row.best !== 'none' && <span className="block">{row.bestMeaning.replace(/^(highest|lowest): /, '')}</span>}
                {row.key === 'planVerdict' && <span className="block">read it first: best is marked only for plans that fit</span>}
              </td>
              {row.cells.map((cell, i) => {
                const best = row.bestIndices.includes(i);
                if (row.key === 'planVerdict') {
                  return (
                    <td key={chosen[i]?.key ?? i} className="px-2 py-2 text-right" data-verdict={cell.verdict}>
                      <VerdictStamp status={cell.verdict ?? 'not-judged'} />
                      {cell.verdict === 'does-not-fit' && <span className="block pt-0.5 text-xs text-ink-soft">not ranked in the rows below</span>}
                    </td>
                  );
                }
                const pastLimit = pastLimitMark(row, cell, chosen[i]);
                return (
                  <td
                    key={chosen[i]?.key ?? i}
                    className={`numeric px-2 py-2 text-right ${best ? 'bg-teal-light/70' : ''}`}
                    data-best={best || undefined}
                    data-excluded={cell.excluded || undefined}
                  >
                    <span className={best ? 'font-semibold text-teal-dark' : 'text-ink'}>{rowValueText(row, cell.value, system)}</span>
                    {pastLimit && (
                      <span
                        className="ml-1.5 whitespace-nowrap text-[0.65rem] font-semibold uppercase tracking-wide text-limit"
                        title="Found where a limit is crossed: never marked best"
                      >
                        past a limit
                      </span>
                    )}
                    {best && <span className="ml-1.5 rounded bg-teal px-1 py-px text-[0.65rem] font-bold uppercase tracking-wide text-white">best</span>}
                    {cell.value !== null && cell.rpm !== null && row.key !== 'peakBrakePowerRpm' && (
                      <span className="block text-xs text-ink-faint">at {formatNumber(cell.rpm, 21)} rpm</span>
                    )}
                    {emptyCellWords(row, cell) !== null && <span className="block text-xs text-ink-faint">{emptyCellWords(row, cell)}</span>}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
