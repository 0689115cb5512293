import { RESULT_COLUMNS, type ResultColumn } from '#shared/matching/results-table';
import { planColour } from '#src/components/plots/style';
import type { StudyLine } from '#src/components/study/lines';
import { cellValue, columnUnit, emptyCellNote, NOT_REACHABLE, resultTableRows, type ResultTableRow } from '#src/components/study/result-rows';
import { formatNumber, type UnitSystem, useUnitSystem } from '#src/lib/quantities';

/** Result columns per printed table: the rest go into the next table under it, rpm repeated. */
export const COLUMNS_PER_PRINTED_TABLE = 9;

/** The result columns after engine speed, split into blocks that fit across a portrait page. */
export function columnBlocks(columns: readonly ResultColumn[] = RESULT_COLUMNS, size = COLUMNS_PER_PRINTED_TABLE): ResultColumn[][] {
  const rest = columns.filter((c) => c.key !== 'rpm');
  const out: ResultColumn[][] = [];
  for (let i = 0; i < rest.length; i += size) out.push(rest.slice(i, i + size));
  return out;
}

function cellText(row: ResultTableRow, column: ResultColumn, system: UnitSystem): string {
  const v = cellValue(row, column, system);
  if (v !== null) return column.kind === 'speed' ? formatNumber(Math.round(v), 21) : formatNumber(v, 4);
  return emptyCellNote(row, column)?.text ?? '—';
}

/** The columns that have a value somewhere in the study; a column empty everywhere (e.g. the turbine's, without a turbine) is left off paper. */
export function filledColumns(
  lines: readonly StudyLine[],
  columns: readonly ResultColumn[] = RESULT_COLUMNS,
): { shown: ResultColumn[]; empty: ResultColumn[] } {
  const shown: ResultColumn[] = [];
  const empty: ResultColumn[] = [];
  for (const c of columns) {
    const filled = lines.some((l) => l.line.points.some((p) => typeof p.values?.[c.key] === 'number' && Number.isFinite(p.values[c.key] as number)));
    (filled ? shown : empty).push(c);
  }
  return { shown, empty };
}

/**
 * Every point of every operating line as static tables for paper: one heading per line, its
 * columns split across as many tables as it takes, engine speed first in each.
 */
export function PrintResults({ lines }: { lines: readonly StudyLine[] }) {
  const system = useUnitSystem();
  const { shown, empty } = filledColumns(lines);
  const blocks = columnBlocks(shown);
  const rpmColumn = RESULT_COLUMNS.find((c) => c.key === 'rpm')!;
  return (
    <div className="space-y-6">
      {empty.length > 0 && (
        <p className="text-sm text-ink-soft">Not computed in this study, so left out: {empty.map((c) => c.label.toLowerCase()).join(', ')}.</p>
      )}
      {lines.map((line) => {
        const rows = resultTableRows([line]);
        return (
          <section key={line.key} className="report-line space-y-2" aria-label={`Results: ${line.label}`}>
            <h3 className="flex items-center gap-2 text-sm font-semibold text-ink">
              <span aria-hidden="true" className="inline-block size-2.5 rounded-full" style={{ background: planColour(line.planIndex) }} />
              {line.label}
            </h3>
            {blocks.map((block, b) => (
              // Focusable so that a keyboard can scroll a table wider than the screen.
              <div key={b} className="overflow-x-auto" tabIndex={0} role="region" aria-label={`${line.label}, columns ${b + 1} of ${blocks.length}`}>
                <table className="report-results w-full border-collapse text-xs">
                  <caption className="sr-only">
                    {line.label}, columns {b + 1} of {blocks.length}
                  </caption>
                  <thead>
                    {/* The line's name in the head, so it repeats on every page the table runs over. */}
                    <tr>
                      <th scope="colgroup" colSpan={block.length + 1} className="px-1.5 pb-0.5 pt-1 text-left text-[0.7rem] font-normal text-ink-soft">
                        {line.label} · columns {b + 1} of {blocks.length}
                      </th>
                    </tr>
                    <tr className="border-b-2 border-ink/25 align-bottom">
                      <th scope="col" className="px-1.5 py-1 text-left font-semibold">
                        {rpmColumn.label}
                        <span className="block font-normal text-ink-soft">rpm</span>
                      </th>
                      {block.map((c) => (
                        <th key={c.key} scope="col" className="px-1.5 py-1 text-right font-semibold">
                          {c.label}
                          <span className="block font-normal text-ink-soft">{columnUnit(c, system)}</span>
                        </th>
                      ))}
                    </tr>
                  </thead>
                  <tbody className="divide-y divide-paper-line">
                    {rows.map((r) => (
                      <tr key={r.id}>
                        <th scope="row" className="numeric px-1.5 py-0.5 text-left font-medium">
                          {formatNumber(r.rpm, 21)}
                          {r.severity === 'limit' && (
                            <span className="ml-1 font-bold text-limit" title="A limit is crossed at this point">
                              !
                            </span>
                          )}
                          {r.reachable === 'no' && r.values && <span className="block text-[0.65rem] font-normal text-ink-soft">{r.region}</span>}
                        </th>
                        {block.map((c) => {
                          const text = cellText(r, c, system);
                          return (
                            <td
                              key={c.key}
                              className={`numeric px-1.5 py-0.5 text-right ${text === NOT_REACHABLE ? 'text-[0.65rem] italic leading-tight text-ink-soft' : ''}`}
                            >
                              {text}
                            </td>
                          );
                        })}
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            ))}
          </section>
        );
      })}
    </div>
  );
}
