import type { PlanePoint } from '#shared/tracer/affine';
import { curveTitle, type TraceBuild } from '#shared/tracer/build';
import { traceKindsOf, type TraceCurveKind, type TraceState } from '#shared/tracer/state';
import { Button } from '#src/components/Button';
import { LINE_COLOURS } from '../lib/draw';
import { addCurve, removeCurve, setCurveValue } from '../state/edits';
import { NumberField } from './fields';
import type { ChangeTrace } from '../state/use-trace-history';

const ADD_WORDS: Record<TraceCurveKind, string> = {
  surge: 'Add surge line',
  choke: 'Add choke limit',
  speed: 'Add speed line',
  island: 'Add efficiency island',
  flow: 'Add flow line',
};

const HOW: Record<TraceCurveKind, string> = {
  surge: 'Click along the surge line, anywhere along it: the file lists its points by rising pressure ratio.',
  choke: 'Click along the choke limit: the file lists its points by rising pressure ratio.',
  speed: 'Click along the speed line, in any order: the file lists its points by rising flow.',
  island: 'Click round the island in order; it is closed for you.',
  flow: 'Click along the line, in any order: the file lists its points by rising expansion ratio.',
};

/**
 * Step 3: trace. Add a line, type its speed or efficiency, click along it in the picture; drag a
 * point to move it, select one and press Delete to remove it. Each line is drawn as it will be
 * written, so a wrong speed or a stray click shows at once.
 */
export function LinesPanel({
  state,
  build,
  change,
  disabled,
  activeCurveId,
  onActivate,
  selectedPoint,
  readValues,
  onDeleteSelected,
}: {
  state: TraceState;
  build: TraceBuild;
  change: ChangeTrace;
  disabled: boolean;
  activeCurveId: string | null;
  onActivate: (id: string | null) => void;
  selectedPoint: { curveId: string; index: number } | null;
  /** Words for a clicked point's values, through the calibration (null before one fits). */
  readValues: (pixel: PlanePoint) => string | null;
  onDeleteSelected: () => void;
}) {
  const kinds = traceKindsOf(state.kind);
  const active = state.curves.find((c) => c.id === activeCurveId) ?? null;
  const selectedCurve = selectedPoint ? state.curves.find((c) => c.id === selectedPoint.curveId) : undefined;
  const selectedPixel = selectedCurve?.points[selectedPoint!.index];

  function add(kind: TraceCurveKind) {
    const { id } = addCurve(state, kind);
    change((s) => addCurve(s, kind).state);
    onActivate(id);
  }

  return (
    <fieldset disabled={disabled} className="space-y-5">
      <legend className="sr-only">Trace the lines</legend>
      {!build.calibration.ok && (
        <p className="rounded-md border border-copper/50 bg-copper-light/40 px-3 py-2 text-sm text-ink">
          The axes are not calibrated yet: points can be clicked now, and get their values once the calibration fits.
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        {kinds.map((kind) => {
          const single = (kind === 'surge' || kind === 'choke') && state.curves.some((c) => c.kind === kind);
          return (
            <Button key={kind} onClick={() => add(kind)} disabled={single} title={single ? 'A map has one; trace more points on it instead.' : undefined}>
              {ADD_WORDS[kind]}
            </Button>
          );
        })}
      </div>

      <p className="text-sm text-ink-soft" aria-live="polite">
        {active ? (
          <>
            Tracing <b>{curveTitle(active, state)}</b>. {HOW[active.kind]} Drag a point to move it; select it and press Delete to remove it.
          </>
        ) : state.curves.length ? (
          'Choose a line below to trace it, or add another.'
        ) : (
          'Add a line, then click along it in the picture.'
        )}
      </p>

      {state.curves.length > 0 && (
        <ol className="space-y-2" aria-label="Traced lines">
          {state.curves.map((curve, index) => {
            const n = index + 1;
            const isActive = curve.id === activeCurveId;
            const problems = build.problems.filter((p) => p.curveId === curve.id);
            return (
              <li key={curve.id} className={`space-y-2 rounded-md border p-3 ${isActive ? 'border-teal bg-teal-light/40' : 'border-paper-line bg-white/60'}`}>
                <div className="flex flex-wrap items-center gap-2">
                  <span aria-hidden="true" className="size-3 shrink-0 rounded-full" style={{ background: LINE_COLOURS[curve.kind] }} />
                  <button
                    type="button"
                    aria-pressed={isActive}
                    onClick={() => onActivate(isActive ? null : curve.id)}
                    className="flex-1 text-left text-sm font-semibold text-ink hover:text-teal-dark"
                  >
                    {n}. {curveTitle(curve, state)}
                  </button>
                  <span className="numeric text-xs text-ink-soft">
                    {curve.points.length} {curve.points.length === 1 ? 'point' : 'points'}
                  </span>
                </div>
                <div className="flex flex-wrap items-end gap-2">
                  {(curve.kind === 'speed' || curve.kind === 'flow') && (
                    <NumberField
                      className="w-40"
                      label={`Speed, line ${n}`}
                      unit={state.speedUnit}
                      value={curve.speed}
                      onChange={(value) => change((s) => setCurveValue(s, curve.id, 'speed', value), `speed-${curve.id}`)}
                    />
                  )}
                  {curve.kind === 'island' && (
                    <NumberField
                      className="w-40"
                      label={`Efficiency, line ${n}`}
                      unit={state.efficiency === 'percent' ? '%' : '(fraction)'}
                      value={curve.efficiency}
                      onChange={(value) => change((s) => setCurveValue(s, curve.id, 'efficiency', value), `efficiency-${curve.id}`)}
                    />
                  )}
                  <Button variant={isActive ? 'primary' : 'secondary'} onClick={() => onActivate(curve.id)} aria-label={`Trace line ${n}`}>
                    {isActive ? 'Tracing' : 'Trace'}
                  </Button>
                  <Button
                    variant="quiet"
                    aria-label={`Delete line ${n}`}
                    onClick={() => {
                      change((s) => removeCurve(s, curve.id));
                      if (isActive) onActivate(null);
                    }}
                  >
                    Delete
                  </Button>
                </div>
                {problems.length > 0 && (
                  <ul className="list-disc space-y-0.5 pl-5 text-xs text-copper-ink">
                    {problems.map((p, i) => (
                      <li key={i}>{p.message}</li>
                    ))}
                  </ul>
                )}
              </li>
            );
          })}
        </ol>
      )}

      {selectedCurve && selectedPixel && (
        <div className="flex flex-wrap items-center gap-3 rounded-md border border-paper-line bg-white/70 p-3 text-sm">
          <p className="flex-1">
            Point {selectedPoint!.index + 1} of {curveTitle(selectedCurve, state)}
            {readValues(selectedPixel) ? `: ${readValues(selectedPixel)}` : ''}. Arrow keys nudge it (Shift: 10 px).
          </p>
          <Button variant="destructive" onClick={onDeleteSelected}>
            Delete point
          </Button>
        </div>
      )}
    </fieldset>
  );
}
