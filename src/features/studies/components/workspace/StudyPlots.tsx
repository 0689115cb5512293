import { memo, useCallback, useDeferredValue, useId, useLayoutEffect, useMemo, useRef, useState } from 'react';
import type { SpoolbookMap } from '#shared/maps/types';
import { Card } from '#src/components/Card';
import { CompressorMapPlot } from '#src/components/plots/CompressorMapPlot';
import { PlotPlaceholder } from '#src/components/plots/Plot';
import { TurbineMapPlot } from '#src/components/plots/TurbineMapPlot';
import { ExhaustSummary } from '#src/components/study/ExhaustSummary';
import { FindingsList } from '#src/components/study/FindingsList';
import { PlanSwatch } from '#src/components/study/PlanSwatch';
import { findPoint, mapLineViews, turbineLineViews, type PointRef } from '#src/components/study/lines';
import { PlanVerdicts } from '#src/components/study/PlanVerdicts';
import { ResultsTable } from '#src/components/study/ResultsTable';
import { RpmCurves } from '#src/components/study/RpmCurves';
import { studyDriveLive } from '#src/components/study/run';
import { WorkingPanel } from '#src/components/study/WorkingPanel';
import type { Computed } from './use-study-editor';

const MemoMap = memo(CompressorMapPlot);
const MemoTurbineMap = memo(TurbineMapPlot);
const MemoCurves = memo(RpmCurves);
const MemoTable = memo(ResultsTable);
const MemoFindings = memo(FindingsList);
const MemoVerdicts = memo(PlanVerdicts);

/**
 * The centre of the study page: the verdict of each plan first, then the compressor map with the operating lines, the findings and
 * the Working of the selected point, the curves against rpm and the results table. Everything
 * here follows `computed`, which the page recomputes on every valid edit.
 */
export function StudyPlots({
  computed,
  stale,
  mapsById,
  namesById,
  mapErrors,
  selected,
  onSelect,
  title,
}: {
  computed: Computed | null;
  /** The inputs have a problem (or a map is loading): what shows is the last valid result. */
  stale: boolean;
  mapsById: Record<string, SpoolbookMap | undefined>;
  namesById: Record<string, string>;
  mapErrors: { mapId: string; message: string }[];
  selected: PointRef | null;
  onSelect: (point: PointRef | null) => void;
  title: string;
}) {
  const mapChoiceId = useId();
  // The map answers an edit first; findings, curves and the table follow in a render React may
  // interrupt, so typing stays quick on a long study.
  const later = useDeferredValue(computed);
  const [mapPlanId, setMapPlanId] = useState<string | null>(null);
  const [showOthers, setShowOthers] = useState(false);
  const [flowAxis, setFlowAxis] = useState<'corrected' | 'volume'>('corrected');
  const turbineChoiceId = useId();
  const [turbinePlanId, setTurbinePlanId] = useState<string | null>(null);

  const plans = computed?.doc.plans ?? [];
  const selectedLine = computed && selected ? computed.lines.find((l) => l.key === selected.lineKey) : undefined;
  // The plan whose map is drawn: the chosen one, else the selected point's plan, else the first.
  const drawnPlan = plans.find((p) => p.id === mapPlanId) ?? plans[0];
  const drawnMapId = drawnPlan?.compressorMapId ?? null;
  const drawnMap = drawnMapId ? mapsById[drawnMapId] : undefined;
  const distinctMaps = [...new Set(plans.map((p) => p.compressorMapId ?? ''))];
  const sharedMap = distinctMaps.length <= 1;

  const mapLines = useMemo(() => {
    if (!computed) return [];
    const shown = computed.lines.filter((l) => sharedMap || showOthers || computed.doc.plans[l.planIndex]?.compressorMapId === drawnMapId);
    return mapLineViews(shown);
  }, [computed, sharedMap, showOthers, drawnMapId]);

  // The turbine map: plans with an exhaust side and a turbine map; one map drawn at a time.
  const turbinePlans = useMemo(() => (computed?.doc.plans ?? []).filter((p) => p.exhaust && p.turbineMapId), [computed]);
  const turbinePlan = turbinePlans.find((p) => p.id === turbinePlanId) ?? turbinePlans[0];
  const turbineMapId = turbinePlan?.turbineMapId ?? null;
  const turbineMap = turbineMapId ? mapsById[turbineMapId] : undefined;
  const sharedTurbineMap = new Set(turbinePlans.map((p) => p.turbineMapId)).size <= 1;
  const turbineLines = useMemo(() => {
    if (!computed || !turbineMapId) return [];
    return turbineLineViews(computed.lines.filter((l) => computed.doc.plans[l.planIndex]?.turbineMapId === turbineMapId));
  }, [computed, turbineMapId]);

  // With a car in the study, each plan's time to boost joins its verdict.
  const drive = useMemo(() => (later?.doc.vehicle ? studyDriveLive(later.doc, later.result, mapsById) : null), [later, mapsById]);
  const selectedPoint = computed ? findPoint(computed.lines, selected) : null;
  const highlight = useMemo(() => (selected ? { lineKey: selected.lineKey, rpm: selected.rpm } : null), [selected]);

  // One stable handler for the memoised plots and table; it reads the latest state through a ref.
  const latest = useRef({ computed, drawnMapId, sharedMap, onSelect });
  useLayoutEffect(() => {
    latest.current = { computed, drawnMapId, sharedMap, onSelect };
  });
  const select = useCallback((point: PointRef) => {
    const { computed: c, drawnMapId: drawn, sharedMap: shared, onSelect: notify } = latest.current;
    notify(point);
    // A point of a plan on another map: draw that map, so the ring lands where the point is.
    const line = c?.lines.find((l) => l.key === point.lineKey);
    const plan = line ? c?.doc.plans[line.planIndex] : undefined;
    if (plan && plan.compressorMapId !== drawn && !shared) setMapPlanId(plan.id);
    if (plan?.exhaust && plan.turbineMapId) setTurbinePlanId(plan.id);
  }, []);
  const selectOnMap = useCallback((lineKey: string, rpm: number) => select({ lineKey, rpm }), [select]);

  if (!computed) {
    return (
      <div className="space-y-4">
        <PlotPlaceholder height={520} label={mapErrors.length ? 'A map of the study could not be loaded.' : 'Loading the study’s maps…'} />
      </div>
    );
  }

  const mapMissing = drawnMapId && !drawnMap;
  const outletLimit = computed.doc.engine.limits?.maxCompressorOutletTemperature ?? null;

  return (
    <div className={`space-y-5 transition-opacity ${stale ? 'opacity-60' : ''}`} aria-busy={stale}>
      <Card>
        <MemoVerdicts lines={(later ?? computed).lines} selected={selected} onSelect={select} drive={drive?.byPlan} />
      </Card>
      <Card
        title="Compressor map"
        data-testid="study-map"
        actions={
          !sharedMap ? (
            <div className="flex min-w-0 max-w-full flex-wrap items-end gap-3 text-sm">
              <div className="min-w-0 max-w-full space-y-1">
                <label htmlFor={mapChoiceId} className="block font-semibold text-ink">
                  Map drawn
                </label>
                <select
                  id={mapChoiceId}
                  value={drawnPlan?.id ?? ''}
                  onChange={(e) => setMapPlanId(e.target.value)}
                  className="max-w-full rounded-md border border-ink/25 bg-white px-2 py-1.5"
                >
                  {plans.map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.name}: {p.compressorMapId ? (namesById[p.compressorMapId] ?? p.compressorMapId) : 'no map'}
                    </option>
                  ))}
                </select>
              </div>
              <label className="flex items-center gap-2 pb-1.5">
                <input type="checkbox" checked={showOthers} onChange={(e) => setShowOthers(e.target.checked)} className="size-4 accent-teal" />
                Other plans’ lines too
              </label>
            </div>
          ) : undefined
        }
      >
        {!sharedMap && showOthers && (
          <p className="mb-2 text-xs text-ink-soft">
            The other plans’ lines are placed by their own maps’ corrected flow; read their margins from their own map (choose it above) or in the findings.
          </p>
        )}
        {mapMissing && <p className="mb-2 text-sm text-copper-ink">The map of this plan could not be loaded; its lines are drawn on plain axes.</p>}
        <div className="mb-2 flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-ink-soft">
          {plans.map((p, i) => (
            <span key={p.id} className="flex items-center gap-1.5">
              <PlanSwatch index={i} />
              {p.name}
            </span>
          ))}
        </div>
        <p className="mb-2 text-xs text-ink-soft">
          Scenarios by line dash. A red outline marks a point at a limit, copper a warning; a hollow, crossed point is not reachable with this compressor.
        </p>
        <MemoMap
          map={drawnMap && drawnMap.kind === 'compressor' ? drawnMap : null}
          lines={mapLines}
          flowAxis={flowAxis}
          onFlowAxisChange={setFlowAxis}

          highlight={highlight}
          onPointClick={selectOnMap}
          height={540}
          exportName={`${title} map`}
        />
      </Card>

      {turbinePlan && (
        <Card
          title="Turbine map"
          data-testid="study-turbine-map"
          actions={
            !sharedTurbineMap ? (
              <div className="min-w-0 max-w-full space-y-1 text-sm">
                <label htmlFor={turbineChoiceId} className="block font-semibold text-ink">
                  Map drawn
                </label>
                <select
                  id={turbineChoiceId}
                  value={turbinePlan.id}
                  onChange={(e) => setTurbinePlanId(e.target.value)}
                  className="max-w-full rounded-md border border-ink/25 bg-white px-2 py-1.5"
                >
                  {turbinePlans.map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.name}: {p.turbineMapId ? (namesById[p.turbineMapId] ?? p.turbineMapId) : 'no map'}
                    </option>
                  ))}
                </select>
              </div>
            ) : undefined
          }
        >
          <p className="mb-2 text-xs text-ink-soft">
            Where each turbine runs: expansion ratio across the turbine against the flow it swallows. Points below the boost threshold run with the gates shut;
            above it the gates pass the rest. A red or copper outline marks a point with a finding.
          </p>
          {turbineMap && turbineMap.kind === 'turbine' ? (
            <MemoTurbineMap
              map={turbineMap}
              lines={turbineLines}
              highlight={highlight}
              onPointClick={selectOnMap}
              height={480}
              exportName={`${title} turbine map`}
            />
          ) : (
            <PlotPlaceholder
              height={320}
              label={mapErrors.some((e) => e.mapId === turbineMapId) ? 'The turbine map of this plan could not be loaded.' : 'Loading the turbine map…'}
            />
          )}
          <div className="mt-4">
            <ExhaustSummary lines={(later ?? computed).lines} />
          </div>
        </Card>
      )}

      <div className="grid gap-5 2xl:grid-cols-2">
        <Card title="Findings">
          <MemoFindings lines={(later ?? computed).lines} selected={selected} onSelect={select} />
        </Card>
        <WorkingPanel line={selectedPoint?.line ?? selectedLine ?? null} point={selectedPoint?.point ?? null} onClose={() => onSelect(null)} />
      </div>

      <Card title="Against engine speed">
        <MemoCurves lines={(later ?? computed).lines} highlight={highlight} onPointClick={select} outletTemperatureLimit={outletLimit} exportName={title} />
      </Card>

      <Card title="Results">
        <MemoTable lines={(later ?? computed).lines} selected={selected} onSelect={select} />
      </Card>
    </div>
  );
}
