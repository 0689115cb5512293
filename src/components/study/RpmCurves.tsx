import { useMemo, useState } from 'react';
import { PlotFrame } from '../plots/PlotFrame';
import { hasExhaust, type PointRef, type StudyLine } from './lines';
import { curveViewsFor, rpmCurvesFigure } from './rpm-curves-figure';
import { useUnitSystem } from '#src/lib/quantities';

const VIEWS_WITH_EXHAUST = curveViewsFor(true);
const VIEWS_COMPRESSOR_ONLY = curveViewsFor(false);

/**
 * Curves against engine speed, one quantity at a time (boost, pressure ratio, mass flow, power
 * and torque at crank and wheels, injector duty, compressor outlet temperature, and with the
 * exhaust side: exhaust pressure, turbine power, wastegate): one line per plan × scenario × boost
 * row, told apart like on the map (colour and marker by plan, dash by scenario). The selected
 * point is ringed; clicking a point selects it.
 */
export function RpmCurves({
  lines,
  highlight = null,
  onPointClick,
  height = 380,
  outletTemperatureLimit = null,
  exportName = 'curves',
  initialView = 'boost',
}: {
  lines: readonly StudyLine[];
  highlight?: PointRef | null;
  onPointClick?: (point: PointRef) => void;
  height?: number;
  /** The engine's stated compressor outlet temperature limit, K (drawn as a red guide). */
  outletTemperatureLimit?: number | null;
  exportName?: string;
  initialView?: string;
}) {
  const unitSystem = useUnitSystem();
  const [viewId, setViewId] = useState(initialView);
  const withExhaust = useMemo(() => hasExhaust(lines), [lines]);
  const views = withExhaust ? VIEWS_WITH_EXHAUST : VIEWS_COMPRESSOR_ONLY;
  const view = views.find((v) => v.id === viewId) ?? views[0];
  const legendRows = Math.ceil(lines.length / 2);
  const plotHeight = height + legendRows * 18;
  const figure = useMemo(
    () => rpmCurvesFigure({ lines, view, unitSystem, highlight, height: plotHeight, outletTemperatureLimit }),
    [lines, view, unitSystem, highlight, plotHeight, outletTemperatureLimit],
  );
  return (
    <div data-testid="rpm-curves">
      <PlotFrame
        figure={figure}
        height={plotHeight}
        label={`${view.label} against engine speed`}
        exportName={`${exportName}-${view.id}`}
        controls={
          <div role="group" aria-label="Quantity plotted against rpm" className="flex flex-wrap gap-1">
            {views.map((v) => (
              <button
                key={v.id}
                type="button"
                aria-pressed={v.id === view.id}
                onClick={() => setViewId(v.id)}
                className={`rounded-md border px-2.5 py-1 text-sm font-semibold transition-colors ${
                  v.id === view.id
                    ? 'border-teal bg-teal-light/80 text-teal-dark'
                    : 'border-ink/20 bg-white/70 text-ink-soft hover:border-teal hover:text-teal-dark'
                }`}
              >
                {v.label}
              </button>
            ))}
          </div>
        }
        note={
          withExhaust && (view.id === 'boost' || view.id === 'wastegate') ? (
            <p className="text-xs text-ink-soft">
              {view.id === 'boost'
                ? 'Plans with the exhaust side: the solid line is the boost the turbine holds, the dotted line the target. Where they part, the target is not held.'
                : 'Dotted: the valve fitted to each gate. Where the size needed rises above it, the gates cannot pass enough exhaust and boost creeps above the target.'}
            </p>
          ) : undefined
        }
        onPointClick={onPointClick ? (lineKey, rpm) => onPointClick({ lineKey, rpm }) : undefined}
      />
    </div>
  );
}
