import { useMemo, useState } from 'react';
import { Card } from '#src/components/Card';
import { CompressorMapPlot } from '#src/components/plots/CompressorMapPlot';
import { TurbineMapPlot } from '#src/components/plots/TurbineMapPlot';
import { planColour } from '#src/components/plots/style';
import { ExhaustSummary } from '#src/components/study/ExhaustSummary';
import { PlanVerdicts, reasonPoint, verdictsOfLines } from '#src/components/study/PlanVerdicts';
import { FindingsList, groupFindings } from '#src/components/study/FindingsList';
import { findPoint, mapLineViews, turbineLineViews, type PointRef, type StudyLine } from '#src/components/study/lines';
import { ResultsTable } from '#src/components/study/ResultsTable';
import { RpmCurves } from '#src/components/study/RpmCurves';
import { StudyCaution } from '#src/components/study/StudyCaution';
import { WorkingPanel } from '#src/components/study/WorkingPanel';
import { useComputedStudy, type StudyViewData } from '../study-view';
import { ExhaustNotes } from './ExhaustNotes';

/**
 * The point first shown in the Working: where the first plan that does not fit (else the first
 * with warnings) meets its first reason, as the verdicts above say; else where the most severe
 * finding is; else the first point.
 */
export function firstPointOfInterest(lines: readonly StudyLine[]): PointRef | null {
  const verdicts = verdictsOfLines(lines);
  const judged = verdicts.find((v) => v.status === 'does-not-fit') ?? verdicts.find((v) => v.status === 'fits-with-warnings');
  const reason = judged?.reasons[0];
  const named = judged && reason ? reasonPoint(lines, judged.planIndex, reason) : null;
  if (named) return named;
  const [worst] = groupFindings(lines).filter((g) => g.severity !== 'info');
  if (worst) return { lineKey: worst.line.key, rpm: Math.min(...worst.rpms) };
  const line = lines.find((l) => l.line.points.some((p) => p.solved));
  const point = line?.line.points.find((p) => p.solved);
  return line && point ? { lineKey: line.key, rpm: point.rpm } : null;
}

/** What the map chooser needs of a group of plans drawn on one map (compressor or turbine). */
interface ChoosableGroup {
  key: string;
  title: string;
  planNames: string[];
  lines: StudyLine[];
}

function MapChooser({
  groups,
  value,
  onChange,
  label = 'Compressor map shown',
}: {
  groups: readonly ChoosableGroup[];
  value: string;
  onChange: (key: string) => void;
  label?: string;
}) {
  if (groups.length < 2) return null;
  return (
    <div role="radiogroup" aria-label={label} className="flex flex-wrap gap-1.5">
      {groups.map((g) => (
        <button
          key={g.key}
          type="button"
          role="radio"
          aria-checked={g.key === value}
          onClick={() => onChange(g.key)}
          className={`rounded-md border px-2.5 py-1 text-sm font-semibold transition-colors ${
            g.key === value ? 'border-teal bg-teal-light/80 text-teal-dark' : 'border-ink/20 bg-white/70 text-ink-soft hover:border-teal hover:text-teal-dark'
          }`}
        >
          {g.title}
          <span className="ml-1.5 inline-flex gap-0.5 align-middle" aria-hidden="true">
            {g.lines
              .map((l) => l.planIndex)
              .filter((p, i, all) => all.indexOf(p) === i)
              .map((p) => (
                <span key={p} className="inline-block size-2 rounded-full" style={{ background: planColour(p) }} />
              ))}
          </span>
          <span className="sr-only"> ({g.planNames.join(', ')})</span>
        </button>
      ))}
    </div>
  );
}

/**
 * A computed study that nobody can change here: the verdict of each plan, its maps with the operating lines, the curves,
 * the findings, the Working of a chosen point and the results table. Used by the shared view;
 * a team's viewers can be shown the same.
 */
export function ReadOnlyStudyView({ data }: { data: StudyViewData }) {
  const computed = useComputedStudy(data);
  const [groupKey, setGroupKey] = useState<string | null>(null);
  const [picked, setPicked] = useState<PointRef | null>(null);
  const initial = useMemo(() => firstPointOfInterest(computed.lines), [computed.lines]);
  const selected = picked ?? initial;
  const found = findPoint(computed.lines, selected);

  // The map shown follows the selected point unless the reader chose one.
  const selectedGroup = found ? computed.groups.find((g) => g.lines.some((l) => l.key === found.line.key)) : undefined;
  const group = computed.groups.find((g) => g.key === groupKey) ?? selectedGroup ?? computed.groups[0];
  const mapLines = useMemo(() => mapLineViews(group?.lines ?? []), [group]);
  const limit = data.document.engine.limits?.maxCompressorOutletTemperature ?? null;

  // The turbine map shown, likewise: only maps that loaded can be drawn.
  const [turbineKey, setTurbineKey] = useState<string | null>(null);
  const drawableTurbines = computed.turbineGroups.filter((g) => g.map !== null);
  const unmappedTurbines = computed.turbineGroups.filter((g) => g.map === null);
  const selectedTurbine = found ? drawableTurbines.find((g) => g.lines.some((l) => l.key === found.line.key)) : undefined;
  const turbineGroup = drawableTurbines.find((g) => g.key === turbineKey) ?? selectedTurbine ?? drawableTurbines[0];
  const turbineLines = useMemo(() => turbineLineViews(turbineGroup?.lines ?? []), [turbineGroup]);

  function select(point: PointRef) {
    setPicked(point);
    const owner = computed.groups.find((g) => g.lines.some((l) => l.key === point.lineKey));
    if (owner) setGroupKey(owner.key);
    const turbineOwner = drawableTurbines.find((g) => g.lines.some((l) => l.key === point.lineKey));
    if (turbineOwner) setTurbineKey(turbineOwner.key);
  }

  return (
    <div className="space-y-6" data-testid="read-only-study">
      <StudyCaution />
      <Card>
        <PlanVerdicts lines={computed.lines} selected={selected} onSelect={select} />
      </Card>
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_26rem]">
        <div className="min-w-0 space-y-6">
          <Card title="Compressor map" actions={group ? <span className="text-sm text-ink-soft">{group.planNames.join(', ')}</span> : undefined}>
            <div className="space-y-3">
              <MapChooser groups={computed.groups} value={group?.key ?? ''} onChange={setGroupKey} />
              {group && (
                <CompressorMapPlot
                  map={group.map}
                  lines={mapLines}

                  height={620}
                  highlight={selected}
                  onPointClick={(lineKey, rpm) => select({ lineKey, rpm })}
                  exportName={`${data.title} ${group.title}`}
                />
              )}
            </div>
          </Card>
          {computed.turbineGroups.length > 0 && (
            <Card
              title="Turbine map"
              data-testid="read-only-turbine-map"
              actions={turbineGroup ? <span className="text-sm text-ink-soft">{turbineGroup.planNames.join(', ')}</span> : undefined}
            >
              <div className="space-y-3">
                <MapChooser groups={drawableTurbines} value={turbineGroup?.key ?? ''} onChange={setTurbineKey} label="Turbine map shown" />
                <p className="text-xs text-ink-soft">
                  Where each turbine runs: expansion ratio across the turbine against the flow it swallows. Points below the boost threshold run with the gates
                  shut; above it the gates pass the rest.
                </p>
                {turbineGroup?.map && (
                  <TurbineMapPlot
                    map={turbineGroup.map}
                    lines={turbineLines}
                    height={520}
                    highlight={selected}
                    onPointClick={(lineKey, rpm) => select({ lineKey, rpm })}
                    exportName={`${data.title} ${turbineGroup.title}`}
                  />
                )}
                {unmappedTurbines.map((g) => (
                  <p key={g.key} className="text-sm text-copper-ink">
                    {g.planNames.join(', ')}: no turbine map could be used, so the exhaust side of {g.planNames.length === 1 ? 'this plan' : 'these plans'} is
                    not computed.
                  </p>
                ))}
                <ExhaustSummary lines={computed.lines} />
                <ExhaustNotes document={data.document} />
              </div>
            </Card>
          )}
          <Card title="Curves against engine speed">
            <RpmCurves lines={computed.lines} highlight={selected} onPointClick={select} outletTemperatureLimit={limit} exportName={data.title} />
          </Card>
        </div>
        <div className="min-w-0 space-y-6">
          <Card title="Findings">
            <FindingsList lines={computed.lines} selected={selected} onSelect={select} />
          </Card>
          <WorkingPanel line={found?.line ?? null} point={found?.point ?? null} />
        </div>
      </div>
      <Card title="Results">
        <ResultsTable lines={computed.lines} selected={selected} onSelect={select} />
      </Card>
    </div>
  );
}
