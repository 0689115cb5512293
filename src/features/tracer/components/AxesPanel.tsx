import type { TraceBuild } from '#shared/tracer/build';
import type { ReferenceRole } from '#shared/tracer/calibration';
import { axisQuantities, type TraceReferenceClick, type TraceState } from '#shared/tracer/state';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { addClick, removeClick, setClickValue, setCrossing, setScale } from '../state/edits';
import { ChoiceField, NumberField } from './fields';
import type { ChangeTrace } from '../state/use-trace-history';

const ROLE_WORDS: Record<ReferenceRole, string> = {
  'x-axis': 'Horizontal axis',
  'y-axis': 'Vertical axis',
  crossing: 'Where the axes cross',
  point: 'Known point',
};

/** A reference click's name: "Horizontal axis, point 2". */
export function clickName(click: TraceReferenceClick, clicks: readonly TraceReferenceClick[]): string {
  if (click.role === 'crossing') return ROLE_WORDS.crossing;
  const n = clicks.filter((c) => c.role === click.role).indexOf(click) + 1;
  return `${ROLE_WORDS[click.role]}, point ${n}`;
}

/** Below this the clicks agree as well as a mouse can place them; above the next, one is probably wrong. */
const GOOD_RESIDUAL_PX = 1;
const CHECK_RESIDUAL_PX = 3;

function px(value: number): string {
  return `${value < 10 ? value.toFixed(1) : Math.round(value)} px`;
}

function withUnit(name: string, unit: string | null): string {
  return unit ? `${name} (${unit})` : name;
}

/**
 * Step 2: calibrate. Two clicks on each axis with their values typed, the values where the axes
 * cross, the scales; the least-squares fit and its residual in pixels, per click, so that a bad
 * click shows.
 */
export function AxesPanel({
  state,
  build,
  change,
  disabled,
  armedClickId,
  selectedClickId,
  onArm,
}: {
  state: TraceState;
  build: TraceBuild;
  change: ChangeTrace;
  disabled: boolean;
  armedClickId: string | null;
  selectedClickId: string | null;
  onArm: (id: string | null) => void;
}) {
  const q = axisQuantities(state);
  const clicks = state.calibration.clicks;
  const calibration = build.calibration;
  const axisProblems = build.problems.filter((p) => p.area === 'axes');

  function add(role: ReferenceRole) {
    // Ids are chosen from the state alone, so the one the change will make is known now.
    const { id } = addClick(state, role);
    change((s) => addClick(s, role).state);
    onArm(id);
  }

  return (
    <fieldset disabled={disabled} className="space-y-5">
      <legend className="sr-only">Calibrate the axes</legend>
      <p className="text-sm text-ink-soft">
        Choose <b>Place</b>, then click the spot in the picture: two points on each axis whose values you can read (far apart is best), and the corner where the
        axes meet. Zoom in and use the magnifier for exact clicks. A slightly rotated scan is fine.
      </p>

      <div className="grid grid-cols-2 gap-3">
        <ChoiceField
          label="Horizontal axis scale"
          value={state.scales.x}
          options={[
            { value: 'linear', label: 'Linear' },
            { value: 'log', label: 'Logarithmic' },
          ]}
          onChange={(scale) => change((s) => setScale(s, 'x', scale))}
        />
        <ChoiceField
          label="Vertical axis scale"
          value={state.scales.y}
          options={[
            { value: 'linear', label: 'Linear' },
            { value: 'log', label: 'Logarithmic' },
          ]}
          onChange={(scale) => change((s) => setScale(s, 'y', scale))}
        />
        <NumberField
          label={`${q.x.name} where the axes cross`}
          unit={q.x.unit}
          value={state.calibration.crossing.x}
          onChange={(value) => change((s) => setCrossing(s, 'x', value), 'crossing-x')}
          hint="The value at the vertical axis line."
        />
        <NumberField
          label={`${q.y.name} where the axes cross`}
          unit={q.y.unit}
          value={state.calibration.crossing.y}
          onChange={(value) => change((s) => setCrossing(s, 'y', value), 'crossing-y')}
          hint="The value at the horizontal axis line."
        />
      </div>

      <ol className="space-y-2" aria-label="Reference points">
        {clicks.map((click, index) => {
          const name = clickName(click, clicks);
          const armed = click.id === armedClickId;
          const residual = build.residualsByClick[index];
          return (
            <li
              key={click.id}
              className={`space-y-2 rounded-md border p-3 ${armed ? 'border-teal bg-teal-light/40' : click.id === selectedClickId ? 'border-copper/60 bg-copper-light/30' : 'border-paper-line bg-white/60'}`}
            >
              <div className="flex flex-wrap items-center justify-between gap-2">
                <h4 className="text-sm font-semibold text-ink">{name}</h4>
                <span className="numeric text-xs text-ink-soft">
                  {click.pixel ? `at ${Math.round(click.pixel.x)}, ${Math.round(click.pixel.y)} px` : 'not placed'}
                  {residual !== null && residual !== undefined && (
                    <span className={residual > CHECK_RESIDUAL_PX ? 'font-semibold text-limit' : residual > GOOD_RESIDUAL_PX ? 'text-copper-ink' : ''}>
                      {' '}
                      · off by {px(residual)}
                    </span>
                  )}
                </span>
              </div>
              <div className="flex flex-wrap items-end gap-2">
                {(click.role === 'x-axis' || click.role === 'point') && (
                  <NumberField
                    className="min-w-28 flex-1"
                    label={`${name}: ${q.x.short}`}
                    hideLabel
                    placeholder={withUnit(q.x.name, q.x.unit)}
                    value={click.x}
                    onChange={(value) => change((s) => setClickValue(s, click.id, 'x', value), `click-${click.id}-x`)}
                  />
                )}
                {(click.role === 'y-axis' || click.role === 'point') && (
                  <NumberField
                    className="min-w-28 flex-1"
                    label={`${name}: ${q.y.short}`}
                    hideLabel
                    placeholder={withUnit(q.y.name, q.y.unit)}
                    value={click.y}
                    onChange={(value) => change((s) => setClickValue(s, click.id, 'y', value), `click-${click.id}-y`)}
                  />
                )}
                {click.role === 'crossing' && <p className="flex-1 text-xs text-ink-soft">Takes the crossing values above.</p>}
                <Button
                  variant={armed ? 'primary' : 'secondary'}
                  aria-pressed={armed}
                  aria-label={`Place ${name.toLowerCase()}`}
                  onClick={() => onArm(click.id)}
                >
                  {armed ? 'Click it in the picture' : click.pixel ? 'Place again' : 'Place'}
                </Button>
                <Button variant="quiet" aria-label={`Remove ${name.toLowerCase()}`} onClick={() => change((s) => removeClick(s, click.id))}>
                  Remove
                </Button>
              </div>
            </li>
          );
        })}
      </ol>

      <div className="flex flex-wrap gap-2">
        <Button onClick={() => add('x-axis')}>Add a point on the horizontal axis</Button>
        <Button onClick={() => add('y-axis')}>Add a point on the vertical axis</Button>
        <Button onClick={() => add('point')}>Add a known point</Button>
        {!clicks.some((c) => c.role === 'crossing') && <Button onClick={() => add('crossing')}>Add the corner</Button>}
      </div>

      {calibration.ok ? (
        <CalibrationSummary build={build} clicks={clicks} />
      ) : (
        <Alert tone="info" title="Not calibrated yet">
          <ul className="list-disc space-y-1 pl-4">
            {axisProblems.map((p, i) => (
              <li key={i}>
                {p.clickIndex !== null && clicks[p.clickIndex]
                  ? `${clickName(clicks[p.clickIndex], clicks)}: ${p.message.charAt(0).toLowerCase()}${p.message.slice(1)}`
                  : p.message}
              </li>
            ))}
          </ul>
        </Alert>
      )}
    </fieldset>
  );
}

function CalibrationSummary({ build, clicks }: { build: TraceBuild; clicks: readonly TraceReferenceClick[] }) {
  if (!build.calibration.ok) return null;
  const cal = build.calibration.calibration;
  const worstIndex = build.residualsByClick.reduce<number>((best, r, i, all) => (r !== null && (best < 0 || r > (all[best] ?? -1)) ? i : best), -1);
  const worst = worstIndex >= 0 ? clicks[worstIndex] : null;
  if (cal.degreesOfFreedom === 0) {
    return (
      <Alert tone="info" title="Calibrated from three points, with nothing to check them against">
        Three points always fit exactly, even a wrong one. Place the corner or one more point so that a bad click shows in the residual.
      </Alert>
    );
  }
  const bad = cal.maxResidual > CHECK_RESIDUAL_PX;
  return (
    <Alert
      tone={bad ? 'error' : 'success'}
      title={`Calibrated from ${cal.residuals.length} points: residual ${px(cal.rmsResidual)} RMS, worst ${px(cal.maxResidual)}${worst ? ` (${clickName(worst, clicks).toLowerCase()})` : ''}.`}
    >
      {bad ? (
        <p>
          The clicks do not agree: one is probably off its axis or has a wrong value. The red line at each click shows where the fit puts it; check the worst
          one first.
        </p>
      ) : (
        <p>The dashed grid over the picture is drawn from this fit: it should sit on the picture’s own grid lines.</p>
      )}
    </Alert>
  );
}
