import type { TraceArea, TraceBuild } from '#shared/tracer/build';
import type { TraceState } from '#shared/tracer/state';
import type { CanvasTool } from './TraceCanvas';

/** The four steps of a trace, in order. */
export type Step = 'map' | 'axes' | 'lines' | 'file';
const STEPS: { step: Step; title: string }[] = [
  { step: 'map', title: 'Map' },
  { step: 'axes', title: 'Axes' },
  { step: 'lines', title: 'Lines' },
  { step: 'file', title: 'File' },
];
/** What a click in the picture does at each step. */
export const STEP_TOOLS: Record<Step, CanvasTool> = { map: 'look', axes: 'calibrate', lines: 'trace', file: 'look' };
/** The step where a problem of each area is fixed. */
export const AREA_STEP: Record<TraceArea, Step> = { map: 'map', axes: 'axes', lines: 'lines', file: 'file' };
/** The heading of each step's panel. */
export const STEP_HEADINGS: Record<Step, string> = { map: 'The map', axes: 'Calibrate the axes', lines: 'Trace the lines', file: 'The map file' };

/** The step a trace opens on: a new one on the map's settings, one under way where it was left off. */
export function openingStep(state: TraceState, build: TraceBuild): Step {
  return state.calibration.clicks.every((c) => c.pixel === null) ? 'map' : build.calibration.ok ? 'lines' : 'axes';
}

/** The steps as tabs, each with what is left to fix there. */
export function StepNav({ step, state, build, onChoose }: { step: Step; state: TraceState; build: TraceBuild; onChoose: (step: Step) => void }) {
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
  return (
    <nav aria-label="Steps">
      <ol className="grid grid-cols-4 gap-1 rounded-lg border border-paper-line bg-white/75 p-1">
        {STEPS.map(({ step: s, title }, i) => (
          <li key={s}>
            <button
              type="button"
              aria-current={step === s ? 'step' : undefined}
              onClick={() => onChoose(s)}
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
  );
}
