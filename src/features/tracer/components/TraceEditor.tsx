import { useCallback, useEffect, useMemo, useReducer, useState } from 'react';
import { Link } from 'react-router';
import type { PlanePoint } from '#shared/tracer/affine';
import type { DraftDetail, SavedToLibrary } from '#shared/tracer/api';
import { buildTrace, traceFileName, type TraceArea, type TraceProblem } from '#shared/tracer/build';
import { pixelToData } from '#shared/tracer/calibration';
import { axisQuantities, type TraceState } from '#shared/tracer/state';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { useDocumentTitle } from '#src/components/Page';
import { isApiError } from '#src/lib/api-client';
import { paths } from '#src/lib/paths';
import { pictureUrl } from '../api/keys';
import { staleDraftOf } from '../api/save-draft';
import { useSaveTraceToLibrary } from '../api/save-to-library';
import { buildOverlay } from '../lib/overlay';
import { addPoint, deletePoint, movePoint, placeClick, roundPixel } from '../state/edits';
import { record, redo, startHistory, undo, type TraceHistory } from '../state/history';
import { useDraftSync, type SyncStatus } from '../state/use-draft-sync';
import { AxesPanel } from './AxesPanel';
import { settingId } from './fields';
import { FilePanel } from './FilePanel';
import { FileView } from './FileView';
import { LinesPanel } from './LinesPanel';
import { MapPanel, type ChangeTrace } from './MapPanel';
import { TraceCanvas, type CanvasTargets, type CanvasTool } from './TraceCanvas';

type Step = 'map' | 'axes' | 'lines' | 'file';
const STEPS: { step: Step; title: string }[] = [
  { step: 'map', title: 'Map' },
  { step: 'axes', title: 'Axes' },
  { step: 'lines', title: 'Lines' },
  { step: 'file', title: 'File' },
];
const TOOLS: Record<Step, CanvasTool> = { map: 'look', axes: 'calibrate', lines: 'trace', file: 'look' };
const AREA_STEP: Record<TraceArea, Step> = { map: 'map', axes: 'axes', lines: 'lines', file: 'file' };

type Selection = { kind: 'point'; curveId: string; index: number } | { kind: 'click'; id: string } | null;

type HistoryAction =
  | { type: 'apply'; change: (state: TraceState) => TraceState; key: string | null; now: number }
  | { type: 'undo' }
  | { type: 'redo' }
  | { type: 'reset'; state: TraceState };

function historyReducer(history: TraceHistory, action: HistoryAction): TraceHistory {
  switch (action.type) {
    case 'apply':
      return record(history, action.change(history.present), action.key, action.now);
    case 'undo':
      return undo(history);
    case 'redo':
      return redo(history);
    case 'reset':
      return startHistory(action.state);
  }
}

function firstUnplaced(state: TraceState): string | null {
  return state.calibration.clicks.find((c) => c.pixel === null)?.id ?? null;
}

function format(value: number): string {
  return Number.isFinite(value) ? String(Number(value.toPrecision(5))) : '—';
}

function statusWords(status: SyncStatus): string {
  switch (status.kind) {
    case 'saved':
      return 'Draft saved';
    case 'pending':
      return 'Changes not saved yet…';
    case 'saving':
      return 'Saving the draft…';
    case 'error':
      return `Draft not saved: ${status.message}`;
    case 'conflict':
      return 'Draft changed elsewhere';
  }
}

/**
 * The Tracer's workspace: the picture on the left with the trace over it, the four steps on the
 * right (map, axes, lines, file), the file and its preview below. Every change is one undo step
 * (typing in a field and one drag count as one) and is saved to the draft shortly after.
 */
export function TraceEditor({ teamId, teamName, draft, canEdit }: { teamId: string; teamName: string | null; draft: DraftDetail; canEdit: boolean }) {
  const [history, dispatch] = useReducer(historyReducer, draft.state, startHistory);
  const state = history.present;
  const build = useMemo(() => buildTrace(state), [state]);
  const sync = useDraftSync({ teamId, draft, state, enabled: canEdit });
  const saveMutation = useSaveTraceToLibrary(teamId);

  // A new trace opens on the map's settings; one under way where it was left off.
  const [step, setStep] = useState<Step>(() =>
    draft.state.calibration.clicks.every((c) => c.pixel === null) ? 'map' : buildTrace(draft.state).calibration.ok ? 'lines' : 'axes',
  );
  const [armedClickId, setArmedClickId] = useState<string | null>(() => firstUnplaced(draft.state));
  const [activeCurveId, setActiveCurveId] = useState<string | null>(() => draft.state.curves[draft.state.curves.length - 1]?.id ?? null);
  const [selection, setSelection] = useState<Selection>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [saved, setSaved] = useState<SavedToLibrary | null>(null);
  const [saveError, setSaveError] = useState<string | null>(null);

  useDocumentTitle(`Tracer: ${state.name || draft.name}`);

  const change: ChangeTrace = useCallback(
    (fn, key = null) => {
      if (canEdit) dispatch({ type: 'apply', change: fn, key, now: Date.now() });
    },
    [canEdit],
  );

  // Undo and redo from the keyboard, except in text fields (they have their own).
  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      if (!(event.ctrlKey || event.metaKey) || !canEdit) return;
      const target = event.target as HTMLElement | null;
      if (target && (target.tagName === 'INPUT' || target.tagName === 'TEXTAREA' || target.tagName === 'SELECT')) return;
      const key = event.key.toLowerCase();
      if (key === 'z' && !event.shiftKey) dispatch({ type: 'undo' });
      else if ((key === 'z' && event.shiftKey) || key === 'y') dispatch({ type: 'redo' });
      else return;
      event.preventDefault();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [canEdit]);

  // A selection or active line that undo took away is dropped.
  const validSelection: Selection =
    selection?.kind === 'point'
      ? state.curves.find((c) => c.id === selection.curveId)?.points[selection.index]
        ? selection
        : null
      : selection?.kind === 'click'
        ? state.calibration.clicks.some((c) => c.id === selection.id && c.pixel)
          ? selection
          : null
        : null;
  const activeCurve = state.curves.find((c) => c.id === activeCurveId) ?? null;
  const tool = TOOLS[step];
  const q = axisQuantities(state);

  const overlay = useMemo(
    () =>
      buildOverlay(
        state,
        build,
        {
          activeCurveId: step === 'lines' ? (activeCurve?.id ?? null) : null,
          armedClickId: step === 'axes' ? armedClickId : null,
          selectedClickId: validSelection?.kind === 'click' ? validSelection.id : null,
          selectedPoint: step === 'lines' && validSelection?.kind === 'point' ? validSelection : null,
          showClicks: step === 'axes' || step === 'map' || !build.calibration.ok,
        },
        draft.image,
      ),
    [state, build, step, activeCurve, armedClickId, validSelection, draft.image],
  );

  const targets: CanvasTargets = useMemo(
    () => ({
      points: step === 'lines' && activeCurve ? activeCurve.points.map((pixel, index) => ({ curveId: activeCurve.id, index, pixel })) : [],
      clicks: step === 'axes' ? state.calibration.clicks.flatMap((c) => (c.pixel ? [{ id: c.id, pixel: c.pixel }] : [])) : [],
    }),
    [step, activeCurve, state.calibration.clicks],
  );

  const readValues = useCallback(
    (pixel: PlanePoint): string | null => {
      if (!build.calibration.ok) return null;
      const data = pixelToData(build.calibration.calibration, pixel);
      const unit = (u: string | null) => (u ? ` ${u}` : '');
      return `${q.x.name} ${format(data.x)}${unit(q.x.unit)}, ${q.y.short} ${format(data.y)}${unit(q.y.unit)}`;
    },
    [build.calibration, q.x.name, q.x.unit, q.y.short, q.y.unit],
  );

  const readout = useCallback(
    (pixel: PlanePoint) => {
      const at = `picture ${Math.round(pixel.x)}, ${Math.round(pixel.y)} px`;
      const values = readValues(pixel);
      return values ? `${values} · ${at}` : `${at} · not calibrated yet`;
    },
    [readValues],
  );

  function armNext(after: string) {
    const clicks = state.calibration.clicks;
    const i = clicks.findIndex((c) => c.id === after);
    const next = [...clicks.slice(i + 1), ...clicks.slice(0, i)].find((c) => c.pixel === null && c.id !== after);
    setArmedClickId(next?.id ?? null);
  }

  function onPlace(raw: PlanePoint) {
    if (!canEdit) return;
    const pixel = roundPixel(raw);
    setNotice(null);
    if (step === 'axes') {
      if (!armedClickId) {
        setSelection(null);
        return setNotice('Choose “Place” beside a reference point first, then click its spot in the picture.');
      }
      const id = armedClickId;
      change((s) => placeClick(s, id, pixel));
      setSelection({ kind: 'click', id });
      armNext(id);
    } else if (step === 'lines') {
      if (!activeCurve) return setNotice('Add a line, or choose one to trace, then click along it in the picture.');
      const curveId = activeCurve.id;
      change((s) => addPoint(s, curveId, pixel));
      setSelection({ kind: 'point', curveId, index: activeCurve.points.length });
    }
  }

  function deleteSelected() {
    if (validSelection?.kind === 'point') {
      const { curveId, index } = validSelection;
      change((s) => deletePoint(s, curveId, index));
    } else if (validSelection?.kind === 'click') {
      const { id } = validSelection;
      change((s) => placeClick(s, id, null));
    }
    setSelection(null);
  }

  function nudge(dx: number, dy: number) {
    if (validSelection?.kind === 'point') {
      const { curveId, index } = validSelection;
      const p = state.curves.find((c) => c.id === curveId)!.points[index];
      change((s) => movePoint(s, curveId, index, roundPixel({ x: p.x + dx, y: p.y + dy })), `nudge-${curveId}-${index}`);
    } else if (validSelection?.kind === 'click') {
      const { id } = validSelection;
      const p = state.calibration.clicks.find((c) => c.id === id)!.pixel!;
      change((s) => placeClick(s, id, roundPixel({ x: p.x + dx, y: p.y + dy })), `nudge-${id}`);
    }
  }

  function go(problem: TraceProblem) {
    setStep(AREA_STEP[problem.area]);
    if (problem.curveId) {
      setActiveCurveId(problem.curveId);
      setSelection(problem.pointIndex !== null ? { kind: 'point', curveId: problem.curveId, index: problem.pointIndex } : null);
    }
    if (problem.clickIndex !== null) {
      const click = state.calibration.clicks[problem.clickIndex];
      if (click) {
        setSelection(click.pixel ? { kind: 'click', id: click.id } : null);
        if (!click.pixel) setArmedClickId(click.id);
      }
    }
    if (problem.field) {
      const field = problem.field;
      window.setTimeout(() => document.getElementById(settingId(field))?.focus(), 0);
    }
  }

  async function saveToLibrary() {
    setSaveError(null);
    const sent = state;
    try {
      const result = await sync.exclusive(async () => {
        const r = await saveMutation.mutateAsync({ draftId: draft.id, baseRevision: sync.revision(), state: sent });
        sync.stored(r.draft, sent);
        return r;
      });
      setSaved(result);
    } catch (error) {
      if (staleDraftOf(error)) setSaveError('This trace was changed elsewhere since you opened it; nothing was saved. Reload the page to see the newer trace.');
      else setSaveError(isApiError(error) ? error.message : 'The map could not be saved. Try again.');
    }
  }

  function download() {
    const url = URL.createObjectURL(new Blob([build.text], { type: 'text/csv;charset=utf-8' }));
    const a = document.createElement('a');
    a.href = url;
    a.download = traceFileName(state.name);
    document.body.append(a);
    a.click();
    a.remove();
    window.setTimeout(() => URL.revokeObjectURL(url), 1000);
  }

  const counts: Record<Step, number> = {
    map: build.problems.filter((p) => p.area === 'map').length,
    axes: build.problems.filter((p) => p.area === 'axes').length,
    lines: build.problems.filter((p) => p.area === 'lines').length,
    file: build.problems.length,
  };
  // "ready" only where there is something to be ready: no lines yet is not a finished step.
  const badge: Record<Step, string> = {
    map: counts.map ? `${counts.map} to fix` : 'ready',
    axes: counts.axes ? `${counts.axes} to fix` : build.calibration.ok ? 'ready' : 'not yet',
    lines: counts.lines ? `${counts.lines} to fix` : state.curves.length ? 'ready' : 'none yet',
    file: counts.file ? `${counts.file} to fix` : 'ready',
  };

  const hint = !canEdit
    ? 'Drag to pan, scroll to zoom.'
    : step === 'axes'
      ? armedClickId
        ? 'Click the reference point’s spot in the picture.'
        : 'Choose “Place” on the right, then click in the picture.'
      : step === 'lines'
        ? activeCurve
          ? 'Click to add a point; drag one to move it.'
          : 'Add or choose a line on the right.'
        : 'Drag to pan, scroll to zoom.';

  const status = sync.status;
  return (
    <div className="mx-auto w-full max-w-[1680px] space-y-4">
      <header className="flex flex-wrap items-end justify-between gap-4 border-b border-ink/15 pb-3">
        <div className="space-y-1">
          <p className="text-xs font-semibold uppercase tracking-[0.14em] text-copper-ink">
            <Link to={paths.teamTracer.href(teamId)} className="text-copper-ink">
              {teamName ? `${teamName} · Tracer` : 'Tracer'}
            </Link>
          </p>
          <h1 className="text-2xl font-semibold tracking-tight text-ink">{state.name || draft.name}</h1>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          {canEdit && (
            <p role="status" className={`text-sm ${status.kind === 'error' ? 'text-copper-ink' : 'text-ink-soft'}`}>
              {statusWords(status)}
              {status.kind === 'error' && (
                <Button variant="quiet" onClick={sync.retry}>
                  Try again
                </Button>
              )}
            </p>
          )}
          <Button onClick={() => dispatch({ type: 'undo' })} disabled={!canEdit || history.past.length === 0} aria-keyshortcuts="Control+Z">
            Undo
          </Button>
          <Button onClick={() => dispatch({ type: 'redo' })} disabled={!canEdit || history.future.length === 0} aria-keyshortcuts="Control+Shift+Z">
            Redo
          </Button>
        </div>
      </header>

      {!canEdit && <Alert tone="info">You can look at this trace; editors and owners of the team change it.</Alert>}
      {status.kind === 'conflict' && (
        <Alert tone="error" title="This trace was saved elsewhere (another tab or another person) since you opened it.">
          <p>Saving has stopped so that neither version is lost without you choosing.</p>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button
              onClick={() => {
                const current = sync.takeTheirs();
                if (current) dispatch({ type: 'reset', state: current.state });
              }}
            >
              Load the newer trace
            </Button>
            <Button variant="primary" onClick={sync.keepMine}>
              Keep mine over it
            </Button>
          </div>
        </Alert>
      )}

      <div className="grid gap-4 xl:grid-cols-[minmax(0,1fr)_27rem]">
        <section
          aria-label="Picture"
          className="h-[clamp(26rem,calc(100vh-12rem),62rem)] overflow-hidden rounded-lg border border-paper-line bg-white/75 shadow-sm"
        >
          <TraceCanvas
            imageUrl={pictureUrl(teamId, draft.image.id)}
            imageSize={draft.image}
            overlay={overlay}
            tool={tool}
            readOnly={!canEdit}
            targets={targets}
            readout={readout}
            hint={hint}
            onPlace={onPlace}
            onGrabPoint={(curveId, index) => setSelection({ kind: 'point', curveId, index })}
            onDragPoint={(curveId, index, pixel, dragId) => change((s) => movePoint(s, curveId, index, roundPixel(pixel)), `drag-${dragId}`)}
            onGrabClick={(id) => setSelection({ kind: 'click', id })}
            onDragClick={(id, pixel, dragId) => change((s) => placeClick(s, id, roundPixel(pixel)), `drag-${dragId}`)}
            onDeleteSelection={deleteSelected}
            onNudge={nudge}
            onEscape={() => {
              setSelection(null);
              setArmedClickId(null);
            }}
          />
        </section>

        <aside aria-label="Trace steps" className="space-y-3">
          <nav aria-label="Steps">
            <ol className="grid grid-cols-4 gap-1 rounded-lg border border-paper-line bg-white/75 p-1">
              {STEPS.map(({ step: s, title }, i) => (
                <li key={s}>
                  <button
                    type="button"
                    aria-current={step === s ? 'step' : undefined}
                    onClick={() => {
                      setStep(s);
                      setNotice(null);
                    }}
                    className={`flex w-full flex-col items-center rounded-md px-2 py-1.5 text-sm ${step === s ? 'bg-teal text-white' : 'text-ink hover:bg-teal-light/50'}`}
                  >
                    <span className="font-semibold">
                      {i + 1}. {title}
                    </span>
                    <span className={`numeric text-xs ${step === s ? 'text-white/90' : counts[s] ? 'text-copper-ink' : 'text-ink-soft'}`}>{badge[s]}</span>
                  </button>
                </li>
              ))}
            </ol>
          </nav>
          {notice && (
            <p role="status" className="rounded-md border border-copper/50 bg-copper-light/50 px-3 py-2 text-sm text-ink">
              {notice}
            </p>
          )}
          <div className="max-h-[calc(100vh-16rem)] overflow-y-auto rounded-lg border border-paper-line bg-white/75 p-4 shadow-sm">
            <h2 className="mb-3 text-lg font-semibold text-ink">
              {{ map: 'The map', axes: 'Calibrate the axes', lines: 'Trace the lines', file: 'The map file' }[step]}
            </h2>
            {step === 'map' && <MapPanel state={state} change={change} disabled={!canEdit} />}
            {step === 'axes' && (
              <AxesPanel
                state={state}
                build={build}
                change={change}
                disabled={!canEdit}
                armedClickId={armedClickId}
                selectedClickId={validSelection?.kind === 'click' ? validSelection.id : null}
                onArm={(id) => {
                  setArmedClickId(id);
                  setNotice(null);
                }}
              />
            )}
            {step === 'lines' && (
              <LinesPanel
                state={state}
                build={build}
                change={change}
                disabled={!canEdit}
                activeCurveId={activeCurve?.id ?? null}
                onActivate={(id) => {
                  setActiveCurveId(id);
                  setSelection(null);
                  setNotice(null);
                }}
                selectedPoint={validSelection?.kind === 'point' ? validSelection : null}
                readValues={readValues}
                onDeleteSelected={deleteSelected}
              />
            )}
            {step === 'file' && (
              <FilePanel
                teamId={teamId}
                build={build}
                canEdit={canEdit}
                saving={saveMutation.isPending}
                saveError={saveError}
                saved={saved}
                onSave={() => void saveToLibrary()}
                onDownload={download}
                onGo={go}
              />
            )}
          </div>
        </aside>
      </div>

      <FileView build={build} />
    </div>
  );
}
