import { useEffect, useRef, useState, type ReactNode, type RefObject } from 'react';
import { Link } from 'react-router';
import { BrandMark, BrandWord } from '#src/components/Brand';
import { Button, buttonClass } from '#src/components/Button';
import { CompressorMapPlot } from '#src/components/plots/CompressorMapPlot';
import { TurbineMapPlot } from '#src/components/plots/TurbineMapPlot';
import { mapLineViews, turbineLineViews } from '#src/components/study/lines';
import { ExhaustSummary } from '#src/components/study/ExhaustSummary';
import { PlanVerdicts } from '#src/components/study/PlanVerdicts';
import { StudyCaution } from '#src/components/study/StudyCaution';
import { useDocumentTitle } from '#src/components/Page';
import { formatDateTime } from '#src/lib/format';
import { useComputedStudy, type StudyViewData } from '../study-view';
import { Assumptions } from './Assumptions';
import { ExhaustNotes } from './ExhaustNotes';
import { PrintFindings } from './PrintFindings';
import { PrintResults } from './PrintResults';
import { reportCurveViews, ReportCurves } from './ReportCurves';
import { StudyInputs } from './StudyInputs';
import { unitSystemNames, useUnitSystem } from '#src/lib/quantities';

/** Plot sizes for paper: the report column is as wide as an A4 or Letter page inside its margins. */
const MAP_HEIGHT = 560;
const TURBINE_MAP_HEIGHT = 480;
const CURVE_HEIGHT = 300;

/**
 * How many of the report's plots plotly has drawn. The plots load and draw one by one (plotly is
 * large); printing before they are all there would put empty frames on paper.
 */
function useDrawnPlots(container: RefObject<HTMLElement | null>, expected: number): number {
  const [drawn, setDrawn] = useState(0);
  useEffect(() => {
    const count = () => {
      const plots = container.current?.querySelectorAll('.js-plotly-plot') ?? [];
      let n = 0;
      plots.forEach((p) => {
        if (p.querySelector('.main-svg')) n++;
      });
      setDrawn(n);
      return n;
    };
    if (count() >= expected) return;
    const timer = window.setInterval(() => {
      if (count() >= expected) window.clearInterval(timer);
    }, 250);
    return () => window.clearInterval(timer);
  }, [container, expected]);
  return drawn;
}

function ReportSection({ id, title, children, className = '' }: { id: string; title: string; children: ReactNode; className?: string }) {
  return (
    <section aria-labelledby={`report-${id}`} className={`report-section space-y-4 ${className}`}>
      <h2 id={`report-${id}`} className="border-b border-ink/20 pb-1 text-xl font-semibold text-ink">
        {title}
      </h2>
      {children}
    </section>
  );
}

/**
 * The printable report of a study: title, revision and date, the caution, the verdict of each plan, every input, the
 * assumptions, the maps with every operating line (the turbine maps too when some plan has an
 * exhaust side), the curves, the findings and the results of every point. Made for paper (with
 * src/styles/print.css); on screen it reads as a sheet.
 */
export function StudyReport({
  data,
  backHref,
  backLabel,
  source,
}: {
  data: StudyViewData;
  /** Where "back" leads on screen (the study, or the shared view). */
  backHref: string;
  backLabel: string;
  /** A line under the title saying where the report came from (e.g. "From a share link"). */
  source?: string;
}) {
  const system = useUnitSystem();
  useDocumentTitle(`${data.title} · report`);
  const computed = useComputedStudy(data);
  const printedAt = formatDateTime(new Date().toISOString());
  const doc = data.document;
  const limit = doc.engine.limits?.maxCompressorOutletTemperature ?? null;
  const article = useRef<HTMLElement>(null);
  const turbineGroups = computed.turbineGroups;
  const drawnTurbineMaps = turbineGroups.filter((g) => g.map !== null).length;
  const expectedPlots = computed.groups.length + drawnTurbineMaps + reportCurveViews(computed.lines).length;
  // The turbine maps get a section of their own when some plan has an exhaust side; the sections after it move down one.
  const withTurbine = turbineGroups.length > 0;
  const n = (section: number) => (withTurbine && section >= 4 ? section + 1 : section);
  const drawnPlots = useDrawnPlots(article, expectedPlots);
  const ready = drawnPlots >= expectedPlots;

  return (
    <div className="sb-report-page min-h-screen px-4 py-6">
      <div className="report-toolbar mx-auto mb-4 flex max-w-[calc(680px+4rem)] flex-wrap items-center justify-between gap-3">
        <Link to={backHref} className={buttonClass('quiet', 'px-0')}>
          ← {backLabel}
        </Link>
        <div className="flex items-center gap-3">
          <span className="text-sm text-ink-soft" role="status">
            {ready
              ? 'Prints on A4 or Letter; choose “Save as PDF” in the print dialog for a file.'
              : `Drawing the plots for paper: ${drawnPlots} of ${expectedPlots}…`}
          </span>
          <Button variant="primary" onClick={() => window.print()} disabled={!ready} pending={!ready}>
            Print
          </Button>
        </div>
      </div>

      <article
        ref={article}
        data-plots-ready={ready}
        className="sb-report mx-auto max-w-[calc(680px+4rem)] space-y-8 rounded-sm bg-white px-8 py-8 shadow-md shadow-paper-line"
        data-testid="study-report"
      >
        <header className="space-y-3">
          <div className="flex items-center justify-between gap-3 text-sm text-ink-soft">
            <span className="flex items-center gap-2">
              <BrandMark className="size-6" />
              <BrandWord className="text-base" />
              <span>· Study report</span>
            </span>
            <span>Units: {unitSystemNames[system]}</span>
          </div>
          <h1 className="text-3xl font-semibold tracking-tight text-ink">{data.title}</h1>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 text-sm">
            <dt className="text-ink-soft">Revision</dt>
            <dd className="text-ink">
              {data.revision}, saved {formatDateTime(data.updatedAt)}
            </dd>
            <dt className="text-ink-soft">Printed</dt>
            <dd className="text-ink">{printedAt}</dd>
            {doc.engineLabel && (
              <>
                <dt className="text-ink-soft">Engine</dt>
                <dd className="text-ink">{doc.engineLabel}</dd>
              </>
            )}
            {source && (
              <>
                <dt className="text-ink-soft">Source</dt>
                <dd className="text-ink">{source}</dd>
              </>
            )}
          </dl>
          <StudyCaution />
          {/* The answer first: each plan's verdict on the first page, before the inputs it rests on. */}
          <div className="report-verdicts rounded-md border border-paper-line bg-paper/40 p-3">
            <PlanVerdicts lines={computed.lines} />
          </div>
        </header>

        <ReportSection id="inputs" title="1. Inputs" className="report-first">
          <StudyInputs data={data} />
        </ReportSection>

        <ReportSection id="assumptions" title="2. Assumptions">
          <Assumptions document={doc} groups={computed.groups} />
        </ReportSection>

        <ReportSection id="maps" title="3. Compressor maps with every operating line">
          <p className="text-sm text-ink-soft">
            Each plan is drawn on its own compressor map. Colour and marker tell the plans apart, the line dash the scenarios; a point ringed in red crosses a
            limit, in copper raises a warning; a hollow point with a cross is one the compressor cannot deliver (not reachable), placed where the engine asks to
            be.
          </p>
          {computed.groups.map((g) => (
            <figure key={g.key} className="report-figure space-y-1">
              <figcaption className="text-sm font-semibold text-ink">
                {g.title} <span className="font-normal text-ink-soft">· {g.planNames.join(', ')}</span>
              </figcaption>
              <CompressorMapPlot map={g.map} lines={mapLineViews(g.lines)} height={MAP_HEIGHT} exportName={`${data.title} ${g.title}`} />
            </figure>
          ))}
        </ReportSection>

        {withTurbine && (
          <ReportSection id="turbine-maps" title="4. Turbine maps with every operating line">
            <p className="text-sm text-ink-soft">
              The plans with an exhaust side, each on its own turbine map: expansion ratio across the turbine against the flow it swallows. Points below the
              boost threshold run with the gates shut; above it the gates pass the rest of the exhaust.
            </p>
            {turbineGroups.map((g) =>
              g.map ? (
                <figure key={g.key} className="report-figure space-y-1">
                  <figcaption className="text-sm font-semibold text-ink">
                    {g.title} <span className="font-normal text-ink-soft">· {g.planNames.join(', ')}</span>
                  </figcaption>
                  <TurbineMapPlot map={g.map} lines={turbineLineViews(g.lines)} height={TURBINE_MAP_HEIGHT} exportName={`${data.title} ${g.title}`} />
                </figure>
              ) : (
                <p key={g.key} className="text-sm text-copper-ink">
                  {g.planNames.join(', ')}: no turbine map could be used, so the exhaust side of {g.planNames.length === 1 ? 'this plan' : 'these plans'} is not
                  computed.
                </p>
              ),
            )}
            <ExhaustSummary lines={computed.lines} />
            <ExhaustNotes document={doc} />
          </ReportSection>
        )}

        <ReportSection id="curves" title={`${n(4)}. Curves against engine speed`}>
          <ReportCurves lines={computed.lines} height={CURVE_HEIGHT} limit={limit} exportName={data.title} />
        </ReportSection>

        <ReportSection id="findings" title={`${n(5)}. Findings`}>
          <PrintFindings lines={computed.lines} />
        </ReportSection>

        <ReportSection id="results" title={`${n(6)}. Results by operating point`}>
          <p className="text-sm text-ink-soft">
            Every point of every operating line. Columns continue in the table under each one; boost is gauge, other pressures absolute. A red “!” marks a point
            that crosses a limit; where the compressor cannot deliver a point, its results read “not reachable”.
          </p>
          <PrintResults lines={computed.lines} />
        </ReportSection>

        <footer className="border-t border-paper-line pt-3 text-xs text-ink-faint">
          {data.title} · revision {data.revision} · Spoolbook. Results are estimates from a quasi-steady model; see the caution at the top.
        </footer>
      </article>
    </div>
  );
}
