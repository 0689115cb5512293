import { useId, useState } from 'react';
import { Button } from '#src/components/Button';
import { pathKey, type DocPath, type RpmTableDraft } from '#src/features/studies/lib/draft';
import { localizeIssue } from '#src/features/studies/lib/localize-issue';
import { applyPaste, parsePastedTable } from '#src/features/studies/lib/paste-table';
import { useEditor } from './context';
import { GroupIssue, UnitNumberInput } from './fields';
import { quantityUnit, type StudyQuantity, useUnitSystem } from '#src/lib/quantities';

/**
 * A table by engine speed (volumetric efficiency, lambda, boost): rows of rpm and value, added
 * and removed here, or pasted from a spreadsheet: one column fills the values from the row it
 * is pasted into, two columns (rpm, value) replace the table.
 */
export function RpmTableEditor({
  path,
  rows = [],
  title,
  valueLabel,
  quantity,
  defaultValue,
  testId,
}: {
  /** Where the table is in the document. */
  path: DocPath;
  /** The table at `path`. */
  rows: RpmTableDraft | undefined;
  title: string;
  valueLabel: string;
  quantity: StudyQuantity;
  /** SI value of a first row when the table is empty. */
  defaultValue: number;
  testId?: string;
}) {
  const editor = useEditor();
  const unitSystem = useUnitSystem();
  const captionId = useId();
  const pasteId = useId();
  const unit = quantityUnit(quantity, unitSystem);
  const [pasteMessage, setPasteMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [pasteOpen, setPasteOpen] = useState(false);
  const [pasteText, setPasteText] = useState('');

  function issueAt(at: DocPath, q: StudyQuantity): string | null {
    const issue = editor.issues[pathKey(at)];
    return issue ? localizeIssue(issue, q, unitSystem) : null;
  }

  function setRows(next: RpmTableDraft) {
    editor.update(path, next);
  }

  function paste(text: string, start: number): boolean {
    const result = applyPaste(rows, parsePastedTable(text), start, unit.toSI);
    if (!result.ok) {
      setPasteMessage({ tone: 'error', text: result.message });
      return false;
    }
    setRows(result.rows);
    setPasteMessage({ tone: 'ok', text: result.summary });
    return true;
  }

  function onCellPaste(start: number) {
    return (event: React.ClipboardEvent<HTMLInputElement>) => {
      const text = event.clipboardData.getData('text/plain');
      // One number pastes into the box as usual; lines or columns fill the table.
      if (!/[\n\t]/.test(text.trim())) return;
      event.preventDefault();
      paste(text, start);
    };
  }

  function addRow() {
    const last = rows[rows.length - 1];
    const prev = rows[rows.length - 2];
    const gap = last?.rpm !== undefined && prev?.rpm !== undefined ? last.rpm - prev.rpm : 500;
    setRows([...rows, last ? { rpm: (last.rpm ?? 0) + (gap > 0 ? gap : 500), value: last.value } : { rpm: 3000, value: defaultValue }]);
  }

  return (
    <div className="space-y-2" data-testid={testId}>
      <table className="w-full border-collapse text-sm" aria-describedby={captionId}>
        <caption id={captionId} className="mb-1 text-left font-semibold text-ink">
          {title}
        </caption>
        <thead className="text-xs uppercase tracking-wider text-ink-soft">
          <tr>
            <th scope="col" className="px-1 pb-1 text-right font-semibold">
              Engine speed (rpm)
            </th>
            <th scope="col" className="px-1 pb-1 text-right font-semibold">
              {valueLabel}
              {unit.label ? ` (${unit.label})` : ''}
            </th>
            {!editor.readOnly && (
              <th scope="col" className="w-8 pb-1">
                <span className="sr-only">Remove</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {rows.map((row, i) => (
            <tr key={i} data-rpm={row.rpm}>
              <td className="px-1 py-0.5 align-top">
                <UnitNumberInput
                  compact
                  label={`${title}, row ${i + 1}, engine speed`}
                  value={row.rpm}
                  quantity="speed"
                  readOnly={editor.readOnly}
                  error={issueAt([...path, i, 'rpm'], 'speed')}
                  onChange={(rpm) => rpm !== undefined && setRows(rows.map((r, k) => (k === i ? { ...r, rpm } : r)))}
                  onPaste={onCellPaste(i)}
                />
              </td>
              <td className="px-1 py-0.5 align-top">
                <UnitNumberInput
                  compact
                  label={`${title} at row ${i + 1}, ${valueLabel}`}
                  value={row.value}
                  quantity={quantity}
                  readOnly={editor.readOnly}
                  error={issueAt([...path, i, 'value'], quantity)}
                  onChange={(value) => value !== undefined && setRows(rows.map((r, k) => (k === i ? { ...r, value } : r)))}
                  onPaste={onCellPaste(i)}
                  testId={testId ? `${testId}-value-${row.rpm}` : undefined}
                />
              </td>
              {!editor.readOnly && (
                <td className="py-0.5 text-center align-top">
                  <button
                    type="button"
                    onClick={() => setRows(rows.filter((_r, k) => k !== i))}
                    disabled={rows.length <= 1}
                    aria-label={`Remove row ${i + 1} (${row.rpm} rpm) of ${title}`}
                    title={rows.length <= 1 ? 'A table needs at least one row' : 'Remove this row'}
                    className="rounded px-1.5 py-0.5 text-ink-faint hover:bg-copper-light hover:text-copper-ink disabled:opacity-30"
                  >
                    ×
                  </button>
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
      <GroupIssue path={path} />
      {!editor.readOnly && (
        <div className="flex flex-wrap items-center gap-2">
          <Button variant="quiet" onClick={addRow} disabled={rows.length >= 100}>
            + Add row
          </Button>
          <Button variant="quiet" onClick={() => setPasteOpen((o) => !o)} aria-expanded={pasteOpen} aria-controls={pasteId}>
            Paste from a spreadsheet
          </Button>
        </div>
      )}
      {pasteOpen && !editor.readOnly && (
        <div id={pasteId} className="space-y-2 rounded-md border border-paper-line bg-paper/60 p-3">
          <label htmlFor={`${pasteId}-text`} className="block text-sm text-ink-soft">
            Paste two columns (rpm and {valueLabel.toLowerCase()}
            {unit.label ? ` in ${unit.label}` : ''}) to replace the table, or one column of values to fill the rows from the top. You can also paste straight
            into a box of the table.
          </label>
          <textarea
            id={`${pasteId}-text`}
            rows={4}
            value={pasteText}
            onChange={(e) => setPasteText(e.target.value)}
            className="block w-full rounded-md border border-ink/25 bg-white px-2 py-1 font-mono text-sm"
          />
          <div className="flex gap-2">
            <Button
              onClick={() => {
                if (paste(pasteText, 0)) {
                  setPasteText('');
                  setPasteOpen(false);
                }
              }}
            >
              Use these numbers
            </Button>
            <Button variant="quiet" onClick={() => setPasteOpen(false)}>
              Cancel
            </Button>
          </div>
        </div>
      )}
      {pasteMessage && (
        <p
          role={pasteMessage.tone === 'error' ? 'alert' : 'status'}
          className={`text-sm ${pasteMessage.tone === 'error' ? 'text-copper-ink' : 'text-teal-dark'}`}
        >
          {pasteMessage.text}
        </p>
      )}
    </div>
  );
}
