import { useEffect, useRef, useState } from 'react';
import type { LogColumnMapping, LogMapping } from '#shared/logs/mapping';
import { LOG_QUANTITIES, LOG_QUANTITY_INFO, REQUIRED_QUANTITIES, type LogQuantity } from '#shared/logs/quantities';
import type { ReadProblem } from '#shared/logs/read';
import { MAX_LOG_BYTES } from '#shared/schemas/logs';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Card } from '#src/components/Card';
import { inputClass } from '#src/components/TextField';
import { useMappingPresets, useSavePreset, useUploadLog } from '../api';
import type { WorkerAnswer } from '../worker/messages';

type Table = Extract<WorkerAnswer, { kind: 'table' }>;

/** One row of the mapping step: a column and what the user says it is ('' = not used). */
interface ColumnChoice {
  quantity: LogQuantity | '';
  unit: string;
  reference: 'absolute' | 'gauge';
}

function choicesFrom(names: string[], columns: readonly LogColumnMapping[]): ColumnChoice[] {
  return names.map((name) => {
    const m = columns.find((c) => c.column === name);
    return m ? { quantity: m.quantity, unit: m.unit, reference: m.reference ?? 'absolute' } : { quantity: '', unit: '', reference: 'absolute' };
  });
}

function mappingOf(names: string[], choices: ColumnChoice[]): LogMapping {
  return {
    columns: choices.flatMap((c, i) =>
      c.quantity
        ? [{ column: names[i], quantity: c.quantity, unit: c.unit, ...(LOG_QUANTITY_INFO[c.quantity].pressure ? { reference: c.reference } : {}) }]
        : [],
    ),
  };
}

function problemText(p: ReadProblem): string {
  return `Line ${p.line}${p.column ? `, column ${p.column}` : ''}: ${p.message}`;
}

/**
 * Upload of a log: the file is read in a worker with a progress bar, then the mapping step (a
 * guess from names, units and values, which the user corrects or takes from a team preset), then
 * the file goes to the server with the mapping, which reads it again and stores it whole or not at all.
 */
export function UploadLog({ teamId, studyId, onUploaded }: { teamId: string; studyId: string; onUploaded: (logId: string) => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [table, setTable] = useState<Table | null>(null);
  const [readProblems, setReadProblems] = useState<ReadProblem[]>([]);
  const [choices, setChoices] = useState<ColumnChoice[]>([]);
  const [name, setName] = useState('');
  const [loggedOn, setLoggedOn] = useState('');
  const [presetName, setPresetName] = useState('');
  const worker = useRef<Worker | null>(null);
  const upload = useUploadLog(teamId, studyId);
  const presets = useMappingPresets(teamId);
  const savePreset = useSavePreset(teamId);

  useEffect(() => () => worker.current?.terminate(), []);

  function choose(chosen: File | null) {
    worker.current?.terminate();
    setTable(null);
    setReadProblems([]);
    upload.reset();
    setFile(chosen);
    if (!chosen) return;
    if (chosen.size > MAX_LOG_BYTES) {
      setReadProblems([{ line: 1, message: `The file is larger than ${MAX_LOG_BYTES / 1024 / 1024} MB.` }]);
      return;
    }
    setName(chosen.name.replace(/\.[^.]*$/, ''));
    setProgress(0);
    const w = new Worker(new URL('../worker/read-log.worker.ts', import.meta.url), { type: 'module' });
    worker.current = w;
    w.onmessage = (event: MessageEvent<WorkerAnswer>) => {
      const answer = event.data;
      if (answer.kind === 'progress') setProgress(answer.share);
      else {
        setProgress(null);
        w.terminate();
        if (answer.kind === 'problems') setReadProblems(answer.problems);
        else {
          setTable(answer);
          setChoices(choicesFrom(answer.names, answer.guess));
        }
      }
    };
    w.postMessage({ file: chosen });
  }

  function setChoice(i: number, change: Partial<ColumnChoice>) {
    setChoices((all) =>
      all.map((c, j) => {
        if (j !== i) return c;
        const next = { ...c, ...change };
        if (change.quantity !== undefined) next.unit = change.quantity ? LOG_QUANTITY_INFO[change.quantity].units[0].unit : '';
        return next;
      }),
    );
  }

  const mapping = table ? mappingOf(table.names, choices) : null;
  const mapped = new Set(mapping?.columns.map((c) => c.quantity));
  const missing = REQUIRED_QUANTITIES.filter((q) => !mapped.has(q));
  const serverProblems = ((upload.error?.details as { problems?: ReadProblem[] } | undefined)?.problems ?? []).slice(0, 8);

  return (
    <Card title="Add a logged run">
      <p className="mb-3 text-sm text-ink-soft">
        A CSV or tab-separated export from the engine&apos;s control unit or data logger, up to 100 MB. Any delimiter, decimal comma or point, notes above the
        column names, units in the names or on a line of their own. The file is read in your browser first, so you can say which column is which.
      </p>
      <label className="block text-sm font-medium">
        Log file
        <input
          type="file"
          name="file"
          accept=".csv,.txt,.tsv,.log,text/csv,text/plain"
          className="mt-1 block w-full text-sm"
          onChange={(e) => choose(e.target.files?.[0] ?? null)}
        />
      </label>
      {progress !== null && (
        <div className="mt-3" role="status" aria-live="polite">
          <div className="text-sm">Reading {file?.name}…</div>
          <progress className="mt-1 h-2 w-full accent-teal" value={progress} max={1} aria-label="Reading the log" />
        </div>
      )}
      {readProblems.length > 0 && (
        <Alert tone="error" title="The file could not be read" className="mt-3">
          <ul>
            {readProblems.map((p, i) => (
              <li key={i}>{problemText(p)}</li>
            ))}
          </ul>
        </Alert>
      )}
      {table && mapping && (
        <div className="mt-4">
          <p className="text-sm">
            {table.rowCount.toLocaleString()} rows, {table.names.length} columns ({table.delimiter === '\t' ? 'tab' : `"${table.delimiter}"`}-separated, decimal{' '}
            {table.decimalComma ? 'comma' : 'point'}). Say which column is which; the guess comes from the names, units and values.
          </p>
          {table.problems.length > 0 && (
            <Alert tone="info" title="Some cells are not numbers" className="mt-2">
              {table.problems.slice(0, 3).map(problemText).join(' ')} Rows without time, engine speed or manifold pressure are skipped and counted.
            </Alert>
          )}
          <div className="mt-3 flex flex-wrap items-end gap-2">
            <label className="text-sm">
              Apply a team preset
              <select
                className={`${inputClass} mt-1`}
                aria-label="Apply a team preset"
                value=""
                onChange={(e) => {
                  const preset = presets.data?.find((p) => p.id === e.target.value);
                  if (preset) setChoices(choicesFrom(table.names, preset.mapping.columns));
                }}
              >
                <option value="">{presets.data?.length ? 'Choose…' : 'No presets yet'}</option>
                {presets.data?.map((p) => (
                  <option key={p.id} value={p.id}>
                    {p.name}
                  </option>
                ))}
              </select>
            </label>
          </div>
          <div className="mt-3 overflow-x-auto">
            <table className="w-full text-sm tabular-nums">
              <caption className="sr-only">Column mapping</caption>
              <thead>
                <tr className="text-left">
                  <th className="px-2 py-1">Column</th>
                  <th className="px-2 py-1">First values</th>
                  <th className="px-2 py-1">Quantity</th>
                  <th className="px-2 py-1">Unit</th>
                  <th className="px-2 py-1">Reads</th>
                </tr>
              </thead>
              <tbody>
                {table.names.map((column, i) => {
                  const c = choices[i];
                  const info = c.quantity ? LOG_QUANTITY_INFO[c.quantity] : null;
                  return (
                    <tr key={column} className="border-t border-ink/10" data-column={column}>
                      <td className="px-2 py-1 font-medium">{column}</td>
                      <td className="px-2 py-1 text-ink-soft">
                        {table.preview[i]
                          .slice(0, 3)
                          .map((v) => (Number.isFinite(v) ? String(v) : '—'))
                          .join(', ')}
                      </td>
                      <td className="px-2 py-1">
                        <select
                          className={inputClass}
                          aria-label={`Quantity of ${column}`}
                          value={c.quantity}
                          onChange={(e) => setChoice(i, { quantity: e.target.value as LogQuantity | '' })}
                        >
                          <option value="">Not used</option>
                          {LOG_QUANTITIES.map((q) => (
                            <option key={q} value={q}>
                              {LOG_QUANTITY_INFO[q].label}
                            </option>
                          ))}
                        </select>
                      </td>
                      <td className="px-2 py-1">
                        {info && (
                          <select
                            className={inputClass}
                            aria-label={`Unit of ${column}`}
                            value={c.unit}
                            onChange={(e) => setChoice(i, { unit: e.target.value })}
                          >
                            {info.units.map((u) => (
                              <option key={u.unit} value={u.unit}>
                                {u.label}
                              </option>
                            ))}
                          </select>
                        )}
                      </td>
                      <td className="px-2 py-1">
                        {info?.pressure && (
                          <select
                            className={inputClass}
                            aria-label={`Absolute or gauge: ${column}`}
                            value={c.reference}
                            onChange={(e) => setChoice(i, { reference: e.target.value as 'absolute' | 'gauge' })}
                          >
                            <option value="absolute">absolute</option>
                            <option value="gauge">gauge (over barometric)</option>
                          </select>
                        )}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          {missing.length > 0 && (
            <Alert tone="error" className="mt-3">
              Map a column as {missing.map((q) => LOG_QUANTITY_INFO[q].label.toLowerCase()).join(', ')}: every point needs it.
            </Alert>
          )}
          <div className="mt-3 flex flex-wrap items-end gap-2">
            <label className="text-sm">
              Keep this mapping as
              <input
                className={`${inputClass} mt-1`}
                value={presetName}
                placeholder="Preset name, e.g. Car 7 logger"
                onChange={(e) => setPresetName(e.target.value)}
              />
            </label>
            <Button
              pending={savePreset.isPending}
              disabled={!presetName.trim() || missing.length > 0}
              onClick={() => savePreset.mutate({ name: presetName.trim(), mapping })}
            >
              Save as preset
            </Button>
            {savePreset.isSuccess && <span className="text-sm text-teal-dark">Preset saved.</span>}
            {savePreset.error && <span className="text-sm text-copper-ink">{savePreset.error.message}</span>}
          </div>
          <div className="mt-4 grid gap-3 sm:grid-cols-2">
            <label className="text-sm">
              Name of the run
              <input className={`${inputClass} mt-1 w-full`} value={name} onChange={(e) => setName(e.target.value)} maxLength={120} />
            </label>
            <label className="text-sm">
              Logged on
              <input type="date" className={`${inputClass} mt-1 w-full`} value={loggedOn} onChange={(e) => setLoggedOn(e.target.value)} />
            </label>
          </div>
          {upload.error && (
            <Alert tone="error" title="The log was not saved" className="mt-3">
              <p>{upload.error.message}</p>
              {serverProblems.length > 1 && (
                <ul className="mt-1 list-disc pl-5">
                  {serverProblems.slice(1).map((p, i) => (
                    <li key={i}>{problemText(p)}</li>
                  ))}
                </ul>
              )}
            </Alert>
          )}
          <div className="mt-4">
            <Button
              variant="primary"
              pending={upload.isPending}
              disabled={missing.length > 0 || !file}
              onClick={() =>
                upload.mutate(
                  { file: file!, mapping, name: name.trim() || undefined, loggedOn: loggedOn || undefined },
                  {
                    onSuccess: (log) => {
                      setTable(null);
                      setFile(null);
                      onUploaded(log.id);
                    },
                  },
                )
              }
            >
              Upload the log
            </Button>
          </div>
        </div>
      )}
    </Card>
  );
}
