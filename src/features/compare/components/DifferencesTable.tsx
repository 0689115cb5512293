import type { CompareRow } from '../../../../shared/study/compare';
import { formatNumber } from '../../../components/plots/quantities';
import { quantityUnit, type StudyQuantity } from '../../../components/study/units';
import type { UnitSystem } from '../../../lib/units';
import { CombinationMark, type ChosenLine } from './CombinationMark';

const QUANTITY: Record<string, StudyQuantity> = {
  fraction: 'fraction',
  speed: 'speed',
  power: 'power',
  torque: 'torque',
  temperature: 'temperature',
  ratio: 'ratio',
  count: 'count',
};

/** The unit a row is read in: the user's unit, or words for plain numbers. */
export function rowUnit(row: CompareRow, system: UnitSystem): string {
  if (row.kind === 'ratio') return 'p₂/p₁ (ratio)';
  if (row.kind === 'count') return 'count';
  return quantityUnit(QUANTITY[row.kind] ?? 'ratio', system).label;
}

/** A cell's number in the row's unit; speeds and counts whole. */
export function rowValueText(row: CompareRow, value: number | null, system: UnitSystem): string {
  if (value === null) return '—';
  if (row.kind === 'count') return formatNumber(value, 21);
  const shown = quantityUnit(QUANTITY[row.kind] ?? 'ratio', system).fromSI(value);
  return row.kind === 'speed' ? formatNumber(Math.round(shown), 21) : formatNumber(shown, 4);
}

const BEST_WORDS = { highest: 'Highest', lowest: 'Lowest', none: '—' } as const;

/** One row per figure, one column per chosen line, the best of each row marked. */
export function DifferencesTable({ rows, chosen, system }: { rows: readonly CompareRow[]; chosen: readonly ChosenLine[]; system: UnitSystem }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[40rem] border-collapse text-left text-sm" data-testid="differences-table">
        <caption className="sr-only">Differences between the chosen lines: one row per figure, the best value of each row marked.</caption>
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
              <td className="whitespace-nowrap px-2 py-2 text-ink-soft">{rowUnit(row, system)}</td>
              <td className="px-2 py-2 text-xs text-ink-soft" title={row.bestMeaning}>
                <span className="font-semibold text-ink">{BEST_WORDS[row.best]}</span>
                {row.best !== 'none' && <span className="block">{row.bestMeaning.replace(/^(highest|lowest): /, '')}</span>}
              </td>
              {row.cells.map((cell, i) => {
                const best = row.bestIndices.includes(i);
                return (
                  <td key={chosen[i]?.key ?? i} className={`numeric px-2 py-2 text-right ${best ? 'bg-teal-light/70' : ''}`} data-best={best || undefined}>
                    <span className={best ? 'font-semibold text-teal-dark' : 'text-ink'}>{rowValueText(row, cell.value, system)}</span>
                    {best && (
                      <span className="ml-1.5 rounded bg-teal px-1 py-px text-[0.65rem] font-bold uppercase tracking-wide text-white">
                        best
                      </span>
                    )}
                    {cell.value !== null && cell.rpm !== null && row.key !== 'peakBrakePowerRpm' && (
                      <span className="block text-xs text-ink-faint">at {formatNumber(cell.rpm, 21)} rpm</span>
                    )}
                    {cell.value === null && row.kind !== 'count' && <span className="block text-xs text-ink-faint">{/margin|shaft/i.test(row.label) ? 'no map' : 'not computed'}</span>}
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
