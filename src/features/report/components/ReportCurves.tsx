import { useMemo } from 'react';
import { PlotFrame } from '#src/components/plots/PlotFrame';
import { planColour, planMarker, scenarioDash } from '#src/components/plots/style';
import { hasExhaust, type StudyLine } from '#src/components/study/lines';
import { curveViewsFor, rpmCurvesFigure, type CurveView } from '#src/components/study/rpm-curves-figure';
import { useUnitSystem } from '#src/lib/quantities';

const DASH_ARRAYS: Record<string, string | undefined> = {
  solid: undefined,
  dash: '5 3',
  dot: '1.5 2.5',
  dashdot: '5 2 1.5 2',
  longdash: '8 3',
  longdashdot: '8 2 1.5 2',
};

/** A line's colour, marker and dash as drawn in the plots, small enough for a key. */
export function LineGlyph({ planIndex, scenarioIndex }: { planIndex: number; scenarioIndex: number }) {
  const colour = planColour(planIndex);
  const marker = planMarker(planIndex);
  return (
    <svg aria-hidden="true" viewBox="0 0 32 12" className="h-3 w-8 shrink-0">
      <line x1="1" y1="6" x2="31" y2="6" stroke={colour} strokeWidth="2" strokeDasharray={DASH_ARRAYS[scenarioDash(scenarioIndex)]} />
      {marker === 'square' ? (
        <rect x="12.5" y="2.5" width="7" height="7" fill={colour} />
      ) : marker === 'diamond' ? (
        <path d="M16 1.5 L20.5 6 L16 10.5 L11.5 6 Z" fill={colour} />
      ) : marker.startsWith('triangle') ? (
        <path d={marker === 'triangle-down' ? 'M16 10.5 L20.5 2 L11.5 2 Z' : 'M16 1.5 L20.5 10 L11.5 10 Z'} fill={colour} />
      ) : (
        <circle cx="16" cy="6" r="3.5" fill={colour} />
      )}
    </svg>
  );
}

/** One key for every curve plot of the report: which colour, marker and dash is which line. */
export function LinesKey({ lines }: { lines: readonly StudyLine[] }) {
  return (
    <ul className="report-block grid gap-x-4 gap-y-1 text-xs text-ink sm:grid-cols-2" aria-label="Key to the lines">
      {lines.map((l) => (
        <li key={l.key} className="flex items-center gap-2">
          <LineGlyph planIndex={l.planIndex} scenarioIndex={l.scenarioIndex} />
          <span>{l.label}</span>
        </li>
      ))}
    </ul>
  );
}

function CurvePlot({
  lines,
  view,
  height,
  limit,
  exportName,
}: {
  lines: readonly StudyLine[];
  view: CurveView;
  height: number;
  limit: number | null;
  exportName: string;
}) {
  const system = useUnitSystem();
  const figure = useMemo(() => {
    const f = rpmCurvesFigure({ lines, view, unitSystem: system, highlight: null, height, outletTemperatureLimit: limit });
    // The key above serves every plot; a legend of every line in each would fill the pages.
    return { ...f, layout: { ...f.layout, showlegend: false, margin: { ...f.layout.margin, b: 48 } } };
  }, [lines, view, system, height, limit]);
  return <PlotFrame figure={figure} height={height} label={`${view.label} against engine speed`} exportName={`${exportName}-${view.id}`} />;
}

/** The curve views the report prints: the exhaust views too when some plan has its exhaust side computed. */
export function reportCurveViews(lines: readonly StudyLine[]): CurveView[] {
  return curveViewsFor(hasExhaust(lines));
}

/**
 * What the thin dotted lines of a view are, for paper (the key serves every plot and has no room
 * for them). Only exhaust studies draw them.
 */
const DOTTED_NOTES: Record<string, string> = {
  boost:
    'Solid: the boost the turbine holds; dotted: the boost target. Where the two part, the turbine cannot drive the compressor to the target at that speed.',
  'exhaust-pressure':
    'Drive pressure ratio: the exhaust manifold pressure over the intake manifold pressure. Above 1 the engine pumps against its own exhaust.',
  wastegate:
    'Right: the valve each gate needs to pass its share of the exhaust; dotted: the valve fitted. A needed valve above the fitted one means boost will creep above target.',
};

/** Every curve view of the study, one plot each, sized for paper, with one shared key. */
export function ReportCurves({ lines, height, limit, exportName }: { lines: readonly StudyLine[]; height: number; limit: number | null; exportName: string }) {
  const withExhaust = hasExhaust(lines);
  const views = curveViewsFor(withExhaust);
  return (
    <div className="space-y-5">
      <LinesKey lines={lines} />
      {views.map((view) => (
        <figure key={view.id} className="report-figure space-y-1">
          <figcaption className="text-sm font-semibold text-ink">
            {view.label}
            {withExhaust && DOTTED_NOTES[view.id] && <span className="block text-xs font-normal text-ink-soft">{DOTTED_NOTES[view.id]}</span>}
          </figcaption>
          <CurvePlot lines={lines} view={view} height={height} limit={limit} exportName={exportName} />
        </figure>
      ))}
    </div>
  );
}
