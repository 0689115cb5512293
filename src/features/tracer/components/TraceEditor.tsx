import { useCallback, useMemo, useState } from 'react';
import type { PlanePoint } from '#shared/tracer/affine';
import type { DraftDetail, SavedToLibrary } from '#shared/tracer/api';
import { buildTrace, traceFileName, type TraceProblem } from '#shared/tracer/build';
import { axisQuantities } from '#shared/tracer/state';
import { Alert } from '#src/components/Alert';
import { useDocumentTitle } from '#src/components/Page';
import { isApiError } from '#src/lib/api-client';
import { pictureUrl } from '../api/keys';
import { staleDraftOf } from '../api/save-draft';
import { useSaveTraceToLibrary } from '../api/save-to-library';
import { downloadText } from '../lib/download';
import { buildOverlay } from '../lib/overlay';
import { valuesAt } from '../lib/readout';
import { addPoint, deletePoint, movePoint, placeClick, roundPixel } from '../state/edits';
import { firstUnplaced, nextUnplaced, validSelection, type Selection } from '../state/selection';
import { useDraftSync } from '../state/use-draft-sync';
import { useTraceHistory } from '../state/use-trace-history';
import { AxesPanel } from './AxesPanel';
import { settingId } from './fields';
import { FilePanel } from './FilePanel';
import { FileView } from './FileView';
import { LinesPanel } from './LinesPanel';
import { MapPanel } from './MapPanel';
import { TraceCanvas, type CanvasTargets } from './TraceCanvas';
import { ConflictAlert, TraceHeader } from './TraceHeader';
import { AREA_STEP, openingStep, STEP_HEADINGS, STEP_TOOLS, StepNav, type Step } from './TraceSteps';

/**
 * The Tracer's workspace: the picture on the left with the trace over it, the four steps on the
 * right (map, axes, lines, file), the file and its preview below. Every change is one undo step
 * (typing in a field and one drag count as one) and is saved to the draft shortly after.
 */
export function TraceEditor({ teamId, teamName, draft, canEdit }: { teamId: string; teamName: string | null; draft: DraftDetail; canEdit: boolean }) {
  const history = useTraceHistory(draft.state, canEdit);
  const { state, change } = history;
  const build = useMemo(() => buildTrace(state), [state]);
  const sync = useDraftSync({ teamId, draft, state, enabled: canEdit });
  const saveMutation = useSaveTraceToLibrary(teamId);

  const [step, setStep] = useState<Step>(() => openingStep(draft.state, buildTrace(draft.state)));
  const [armedClickId, setArmedClickId] = useState<string | null>(() => firstUnplaced(draft.state));
  const [activeCurveId, setActiveCurveId] = useState<string | null>(() => draft.state.curves[draft.state.curves.length - 1]?.id ?? null);
  const [selection, setSelection] = useState<Selection>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [saved, setSaved] = useState<SavedToLibrary | null>(null);
  const [saveError, setSaveError] = useState<string | null>(null);

  useDocumentTitle(`Tracer: ${state.name || draft.name}`);

  // A selection or active line that undo took away is dropped.
  const selected = validSelection(selection, state);
  const activeCurve = state.curves.find((c) => c.id === activeCurveId) ?? null;
  const q = useMemo(() => axisQuantities(state), [state]);

  const overlay = useMemo(
    () =>
      buildOverlay(
        state,
        build,
        {
          activeCurveId: step === 'lines' ? (activeCurve?.id ?? null) : null,
          armedClickId: step === 'axes' ? armedClickId : null,
          selectedClickId: selected?.kind === 'click' ? selected.id : null,
          selectedPoint: step === 'lines' && selected?.kind === 'point' ? selected : null,
          showClicks: step === 'axes' || step === 'map' || !build.calibration.ok,
        },
        draft.image,
      ),
    [state, build, step, activeCurve, armedClickId, selected, draft.image],
  );

  const targets: CanvasTargets = useMemo(
    () => ({
      points: step === 'lines' && activeCurve ? activeCurve.points.map((pixel, index) => ({ curveId: activeCurve.id, index, pixel })) : [],
      clicks: step === 'axes' ? state.calibration.clicks.flatMap((c) => (c.pixel ? [{ id: c.id, pixel: c.pixel }] : [])) : [],
    }),
    [step, activeCurve, state.calibration.clicks],
  );

  const readValues = useCallback((pixel: PlanePoint) => valuesAt(build, q, pixel), [build, q]);

  const readout = useCallback(
    (pixel: PlanePoint) => {
      const at = `picture ${Math.round(pixel.x)}, ${Math.round(pixel.y)} px`;
      const values = readValues(pixel);
      return values ? `${values} · ${at}` : `${at} · not calibrated yet`;
    },
    [readValues],
  );

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
      setArmedClickId(nextUnplaced(state, id));
    } else if (step === 'lines') {
      if (!activeCurve) return setNotice('Add a line, or choose one to trace, then click along it in the picture.');
      const curveId = activeCurve.id;
      change((s) => addPoint(s, curveId, pixel));
      setSelection({ kind: 'point', curveId, index: activeCurve.points.length });
    }
  }

  function deleteSelected() {
    if (selected?.kind === 'point') {
      const { curveId, index } = selected;
      change((s) => deletePoint(s, curveId, index));
    } else if (selected?.kind === 'click') {
      const { id } = selected;
      change((s) => placeClick(s, id, null));
    }
    setSelection(null);
  }

  function nudge(dx: number, dy: number) {
    if (selected?.kind === 'point') {
      const { curveId, index } = selected;
      const p = state.curves.find((c) => c.id === curveId)!.points[index];
      change((s) => movePoint(s, curveId, index, roundPixel({ x: p.x + dx, y: p.y + dy })), `nudge-${curveId}-${index}`);
    } else if (selected?.kind === 'click') {
      const { id } = selected;
      const p = state.calibration.clicks.find((c) => c.id === id)!.pixel!;
      change((s) => placeClick(s, id, roundPixel({ x: p.x + dx, y: p.y + dy })), `nudge-${id}`);
    }
  }

  /** Opens the step, line, point or setting a problem of the file is about. */
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

  return (
    <div className="mx-auto w-full max-w-[1680px] space-y-4">
      <TraceHeader
        teamId={teamId}
        teamName={teamName}
        name={state.name || draft.name}
        canEdit={canEdit}
        status={sync.status}
        onRetry={sync.retry}
        canUndo={history.canUndo}
        canRedo={history.canRedo}
        onUndo={history.undo}
        onRedo={history.redo}
      />

      {!canEdit && <Alert tone="info">You can look at this trace; editors and owners of the team change it.</Alert>}
      {sync.status.kind === 'conflict' && (
        <ConflictAlert
          onTakeTheirs={() => {
            const current = sync.takeTheirs();
            if (current) history.reset(current.state);
          }}
          onKeepMine={sync.keepMine}
        />
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
            tool={STEP_TOOLS[step]}
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
          <StepNav
            step={step}
            state={state}
            build={build}
            onChoose={(s) => {
              setStep(s);
              setNotice(null);
            }}
          />
          {notice && (
            <p role="status" className="rounded-md border border-copper/50 bg-copper-light/50 px-3 py-2 text-sm text-ink">
              {notice}
            </p>
          )}
          <div className="max-h-[calc(100vh-16rem)] overflow-y-auto rounded-lg border border-paper-line bg-white/75 p-4 shadow-sm">
            <h2 className="mb-3 text-lg font-semibold text-ink">{STEP_HEADINGS[step]}</h2>
            {step === 'map' && <MapPanel state={state} change={change} disabled={!canEdit} />}
            {step === 'axes' && (
              <AxesPanel
                state={state}
                build={build}
                change={change}
                disabled={!canEdit}
                armedClickId={armedClickId}
                selectedClickId={selected?.kind === 'click' ? selected.id : null}
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
                selectedPoint={selected?.kind === 'point' ? selected : null}
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
                onDownload={() => downloadText(build.text, traceFileName(state.name), 'text/csv;charset=utf-8')}
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
