import { useMemo } from 'react';
import { PlotFrame } from '../../../components/plots/PlotFrame';
import { planColour, planMarker, scenarioDash } from '../../../components/plots/style';
import type { StudyLine } from '../../../components/study/lines';
import { CURVE_VIEWS, rpmCurvesFigure, type CurveView } from '../../../components/study/rpm-curves-figure';
import type { UnitSystem } from '../../../lib/units';

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

function CurvePlot({ lines, view, system, height, limit, exportName }: { lines: readonly StudyLine[]; view: CurveView; system: UnitSystem; height: number; limit: number | null; exportName: string }) {
  const figure = useMemo(() => {
    const f = rpmCurvesFigure({ lines, view, unitSystem: system, highlight: null, height, outletTemperatureLimit: limit });
    // The key above serves every plot; a legend of every line in each would fill the pages.
    return { ...f, layout: { ...f.layout, showlegend: false, margin: { ...f.layout.margin, b: 48 } } };
  }, [lines, view, system, height, limit]);
  return <PlotFrame figure={figure} height={height} label={`${view.label} against engine speed`} exportName={`${exportName}-${view.id}`} />;
}

/** Every curve view of the study, one plot each, sized for paper, with one shared key. */
export function ReportCurves({ lines, system, height, limit, exportName }: { lines: readonly StudyLine[]; system: UnitSystem; height: number; limit: number | null; exportName: string }) {
  return (
    <div className="space-y-5">
      <LinesKey lines={lines} />
      {CURVE_VIEWS.map((view) => (
        <figure key={view.id} className="report-figure space-y-1">
          <figcaption className="text-sm font-semibold text-ink">{view.label}</figcaption>
          <CurvePlot lines={lines} view={view} system={system} height={height} limit={limit} exportName={exportName} />
        </figure>
      ))}
    </div>
  );
}
