import {
  createColumnHelper,
  createPaginatedRowModel,
  createSortedRowModel,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  tableFeatures,
  useTable,
  type PaginationState,
  type SortingState,
} from '@tanstack/react-table';
import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { RESULT_COLUMNS, type ResultColumn } from '#shared/matching/results-table';
import { Button } from '../Button';
import { planColour } from '../plots/style';
import { sameRpm, type PointRef, type StudyLine } from './lines';
import { cellValue, columnUnit, emptyCellNote, resultTableRows, resultsTsv, type ResultTableRow } from './result-rows';
import { formatNumber, type UnitSystem, useUnitSystem } from '#src/lib/quantities';

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric },
  rowPaginationFeature,
  paginatedRowModel: createPaginatedRowModel(),
});
const helper = createColumnHelper<typeof features, ResultTableRow>();

const PAGE_SIZE = 50;

/** Digits shown per quantity: speeds whole, the rest to 4 significant figures. */
function cellText(row: ResultTableRow, column: ResultColumn, system: UnitSystem): string {
  const v = cellValue(row, column, system);
  if (v === null) return '—';
  return column.kind === 'speed' ? formatNumber(Math.round(v), 21) : formatNumber(v, 4);
}

/** A value cell: the number, or in its place "not reachable" or a dash that says why the map gives none. */
function ValueCell({ row, column }: { row: ResultTableRow; column: ResultColumn }) {
  const system = useUnitSystem();
  const note = emptyCellNote(row, column);
  if (!note) return <>{cellText(row, column, system)}</>;
  if (note.text === '—') {
    return (
      // relative: the hidden words stay inside the scrolling table, not off the side of the page.
      <span title={note.why} className="relative cursor-help border-b border-dotted border-ink-faint text-ink-faint">
        —<span className="sr-only"> ({note.why})</span>
      </span>
    );
  }
  return (
    <span title={note.why} className="whitespace-nowrap text-xs italic text-ink-soft">
      {note.text}
    </span>
  );
}

const RPM_COLUMN = RESULT_COLUMNS[0];

function buildColumns(system: UnitSystem) {
  return helper.columns([
    helper.accessor('plan', {
      id: 'plan',
      header: () => <HeaderText label="Plan" />,
      sortFn: 'alphanumeric',
      cell: (info) => (
        <span className="flex items-center gap-1.5 whitespace-nowrap">
          <span aria-hidden="true" className="inline-block size-2.5 rounded-full" style={{ background: planColour(info.row.original.planIndex) }} />
          {info.getValue()}
        </span>
      ),
    }),
    helper.accessor('scenario', {
      id: 'scenario',
      header: () => <HeaderText label="Scenario" />,
      sortFn: 'alphanumeric',
      cell: (info) => <span className="whitespace-nowrap">{info.getValue()}</span>,
    }),
    helper.accessor('row', {
      id: 'row',
      header: () => <HeaderText label="Boost row" />,
      sortFn: 'alphanumeric',
      cell: (info) => <span className="whitespace-nowrap">{info.getValue()}</span>,
    }),
    ...RESULT_COLUMNS.flatMap((column) => {
      const value = helper.accessor((row) => cellValue(row, column, system) ?? undefined, {
        id: column.key,
        header: () => <HeaderText label={column.label} unit={columnUnit(column, system)} />,
        sortUndefined: 'last',
        cell: (info) => <ValueCell row={info.row.original} column={column} />,
      });
      // Where the point sits and whether it can be reached, right after its engine speed: the rest of the row depends on it.
      return column === RPM_COLUMN ? [value, regionColumn, reachableColumn] : [value];
    }),
    helper.accessor('findingCount', {
      id: 'findings',
      header: () => <HeaderText label="Findings" />,
      cell: (info) => {
        const r = info.row.original;
        if (r.findingCount === 0) return <span className="text-ink-faint">none</span>;
        const tone = r.severity === 'limit' ? 'bg-limit text-white' : r.severity === 'warning' ? 'bg-copper-ink text-white' : 'bg-teal-light text-teal-dark';
        return (
          <span title={r.findings} className={`whitespace-nowrap rounded px-1.5 py-0.5 text-xs font-semibold ${tone}`}>
            {r.findingCount} · {r.severity}
          </span>
        );
      },
    }),
  ]);
}

const regionColumn = helper.accessor('region', {
  id: 'mapRegion',
  header: () => <HeaderText label="Map region" />,
  sortFn: 'alphanumeric',
  cell: (info) => <span className="whitespace-nowrap">{info.getValue()}</span>,
});

const reachableColumn = helper.accessor('reachable', {
  id: 'reachable',
  header: () => <HeaderText label="Reachable" />,
  sortFn: 'alphanumeric',
  cell: (info) =>
    info.getValue() === 'no' ? (
      <span className="font-semibold text-limit" title="The compressor cannot deliver this point: its results are not given.">
        no
      </span>
    ) : (
      'yes'
    ),
});

function HeaderText({ label, unit }: { label: string; unit?: string }) {
  return (
    <span className="block">
      <span className="block whitespace-nowrap">{label}</span>
      {unit !== undefined && <span className="block font-normal normal-case tracking-normal text-ink-faint">({unit})</span>}
    </span>
  );
}

async function copyText(text: string): Promise<void> {
  if (navigator.clipboard?.writeText) {
    await navigator.clipboard.writeText(text);
    return;
  }
  // Older browsers and non-secure origins: the selection route still works.
  const area = document.createElement('textarea');
  area.value = text;
  area.setAttribute('readonly', '');
  area.style.position = 'fixed';
  area.style.opacity = '0';
  document.body.appendChild(area);
  area.select();
  const ok = document.execCommand('copy');
  area.remove();
  if (!ok) throw new Error('copy refused');
}

/**
 * Every operating point of the study in a sortable table: units under every column name, the
 * selected point highlighted (and its page shown), a line filter, and "Copy" for spreadsheets
 * (tab-separated, in the user's units, the rows as filtered and sorted).
 */
export function ResultsTable({
  lines,
  selected = null,
  onSelect,
  caption = 'Results by operating point',
}: {
  lines: readonly StudyLine[];
  selected?: PointRef | null;
  onSelect?: (point: PointRef) => void;
  caption?: string;
}) {
  const unitSystem = useUnitSystem();
  const filterId = useId();
  const [lineFilter, setLineFilter] = useState<string>('all');
  const [sorting, setSorting] = useState<SortingState>([]);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: PAGE_SIZE });
  const [copyState, setCopyState] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const selectedRowRef = useRef<HTMLTableRowElement>(null);

  const allRows = useMemo(() => resultTableRows(lines), [lines]);
  const filter = lineFilter !== 'all' && !lines.some((l) => l.key === lineFilter) ? 'all' : lineFilter;
  const data = useMemo(() => (filter === 'all' ? allRows : allRows.filter((r) => r.lineKey === filter)), [allRows, filter]);
  const columns = useMemo(() => buildColumns(unitSystem), [unitSystem]);

  const table = useTable({
    features,
    columns,
    data,
    getRowId: (row) => row.id,
    state: { sorting, pagination },
    onSortingChange: setSorting,
    onPaginationChange: setPagination,
    autoResetPageIndex: false,
  });

  const sortedRows = table.getPrePaginatedRowModel().rows;
  const pageCount = Math.max(1, Math.ceil(sortedRows.length / PAGE_SIZE));
  const selectedId = selected ? (allRows.find((r) => r.lineKey === selected.lineKey && sameRpm(r.rpm, selected.rpm))?.id ?? null) : null;

  // Show the page that holds the selected point, so a click on a finding lands on its row. Only
  // when the selection changes: sorting later must not jump pages under the reader.
  const [shownSelection, setShownSelection] = useState<string | null>(null);
  if (selectedId !== shownSelection) {
    setShownSelection(selectedId);
    const index = selectedId ? sortedRows.findIndex((r) => r.id === selectedId) : -1;
    if (index >= 0) {
      const page = Math.floor(index / PAGE_SIZE);
      if (pagination.pageIndex !== page) setPagination({ ...pagination, pageIndex: page });
    } else if (selectedId && filter !== 'all') {
      setLineFilter('all');
    }
  }

  useEffect(() => {
    selectedRowRef.current?.scrollIntoView({ block: 'nearest', inline: 'nearest' });
  }, [selectedId, pagination.pageIndex]);

  // A page past the end (fewer rows after an edit or a filter) falls back to the last page.
  if (pagination.pageIndex > pageCount - 1) setPagination({ ...pagination, pageIndex: pageCount - 1 });

  async function copy() {
    try {
      await copyText(
        resultsTsv(
          sortedRows.map((r) => r.original),
          unitSystem,
        ),
      );
      setCopyState({ tone: 'ok', text: `Copied ${sortedRows.length} rows as tab-separated text: paste them into a spreadsheet.` });
    } catch {
      setCopyState({ tone: 'error', text: 'The browser did not allow copying. Use the CSV download instead.' });
    }
  }

  const first = sortedRows.length === 0 ? 0 : pagination.pageIndex * PAGE_SIZE + 1;
  const last = Math.min(sortedRows.length, (pagination.pageIndex + 1) * PAGE_SIZE);

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="min-w-0 max-w-full space-y-1">
          <label htmlFor={filterId} className="block text-sm font-semibold text-ink">
            Lines shown
          </label>
          <select
            id={filterId}
            value={filter}
            onChange={(e) => {
              setLineFilter(e.target.value);
              setPagination((p) => ({ ...p, pageIndex: 0 }));
            }}
            className="block max-w-full rounded-md border border-ink/25 bg-white px-3 py-1.5 text-sm"
          >
            <option value="all">Every line ({allRows.length} points)</option>
            {lines.map((l) => (
              <option key={l.key} value={l.key}>
                {l.label}
              </option>
            ))}
          </select>
        </div>
        <div className="flex items-center gap-2">
          <Button onClick={copy} aria-label="Copy the results as tab-separated text">
            Copy
          </Button>
        </div>
      </div>
      {copyState && (
        <p role="status" className={`text-sm ${copyState.tone === 'ok' ? 'text-teal-dark' : 'text-copper-ink'}`}>
          {copyState.text}
        </p>
      )}
      <div className="max-h-[32rem] overflow-auto rounded-md border border-paper-line bg-white/80">
        <table className="w-max min-w-full border-collapse text-left text-sm" data-testid="results-table">
          <caption className="sr-only">{caption}. Column headers sort; units are under each name.</caption>
          <thead className="sticky top-0 z-10 bg-paper text-xs uppercase tracking-wider text-ink-soft shadow-[0_1px_0_rgba(0,0,0,0.15)]">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}
                      className={`px-2.5 py-2 align-bottom font-semibold ${header.id === 'plan' ? 'sticky left-0 z-20 bg-paper' : ''}`}
                    >
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="flex items-end gap-1 text-left uppercase hover:text-ink"
                      >
                        <table.FlexRender header={header} />
                        <span aria-hidden="true" className="w-3 text-ink">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : ''}
                        </span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-paper-line">
            {table.getRowModel().rows.map((row) => {
              const isSelected = row.id === selectedId;
              return (
                <tr
                  key={row.id}
                  ref={isSelected ? selectedRowRef : undefined}
                  data-row={row.id}
                  aria-selected={isSelected}
                  onClick={onSelect ? () => onSelect({ lineKey: row.original.lineKey, rpm: row.original.rpm }) : undefined}
                  // Keyboard users pick a row too: Tab to it, Enter or Space to show its Working.
                  tabIndex={onSelect ? 0 : undefined}
                  onKeyDown={
                    onSelect
                      ? (event) => {
                          if (event.key !== 'Enter' && event.key !== ' ') return;
                          event.preventDefault();
                          onSelect({ lineKey: row.original.lineKey, rpm: row.original.rpm });
                        }
                      : undefined
                  }
                  className={`${onSelect ? 'cursor-pointer' : ''} ${isSelected ? 'bg-teal-light/70' : 'hover:bg-paper-deep/40'}`}
                >
                  {row.getAllCells().map((cell) => (
                    <td
                      key={cell.id}
                      data-column={cell.column.id}
                      className={`numeric px-2.5 py-1.5 ${cell.column.id === 'plan' ? `sticky left-0 ${isSelected ? 'bg-teal-light' : 'bg-white'}` : ''} ${
                        ['plan', 'scenario', 'row', 'findings', 'mapRegion', 'reachable'].includes(cell.column.id) ? '' : 'text-right'
                      }`}
                    >
                      <table.FlexRender cell={cell} />
                    </td>
                  ))}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center justify-between gap-2 text-sm text-ink-soft">
        <span>
          Rows {first}–{last} of {sortedRows.length}
        </span>
        {pageCount > 1 && (
          <div className="flex items-center gap-2">
            <Button onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
              Previous
            </Button>
            <span>
              Page {pagination.pageIndex + 1} of {pageCount}
            </span>
            <Button onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
              Next
            </Button>
          </div>
        )}
      </div>
    </div>
  );
}
