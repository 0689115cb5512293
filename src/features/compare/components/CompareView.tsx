import { useMemo, useState } from 'react';
import type { CompressorMap, SpoolbookMap, TurbineMap } from '#shared/maps/types';
import type { StudyDocument } from '#shared/schemas/study';
import { planVerdicts, VERDICT_RANK } from '#shared/matching/verdict';
import { compareLines } from '#shared/study/compare';
import { Alert } from '#src/components/Alert';
import { Card } from '#src/components/Card';
import { FlowAxisSwitch } from '#src/components/plots/FlowAxisSwitch';
import { PlotFrame } from '#src/components/plots/PlotFrame';
import { planColour } from '#src/components/plots/style';
import { TurbineMapPlot } from '#src/components/plots/TurbineMapPlot';
import { mapLineViews, studyLines, turbineLineViews } from '#src/components/study/lines';
import { RpmCurves } from '#src/components/study/RpmCurves';
import { runStudyLive, studyDriveLive } from '#src/components/study/run';
import { StudyCaution } from '#src/components/study/StudyCaution';
import { compareFigure, type OverlaidMap } from '../compare-figure';
import { allCombinations, MIN_COMBINATIONS, toggleCombination } from '../selection';
import { CombinationMark, type ChosenLine } from './CombinationMark';
import { CombinationPicker } from './CombinationPicker';
import { ChosenVerdicts } from './ChosenVerdicts';
import { DifferencesTable } from './DifferencesTable';
import { formatQuantity, useUnitSystem } from '#src/lib/quantities';

const MAP_HEIGHT = 620;

/** Chosen lines in verdict order, what fits first; lines of one verdict keep the order they were chosen in. */
export function rankByVerdict(chosen: readonly ChosenLine[]): ChosenLine[] {
  const rank = (c: ChosenLine) => VERDICT_RANK[c.verdict?.status ?? 'not-judged'];
  return [...chosen].sort((a, b) => rank(a) - rank(b) || a.index - b.index);
}

function compressorMap(map: SpoolbookMap | undefined): CompressorMap | null {
  return map && map.kind === 'compressor' ? map : null;
}

/**
 * Side by side: two to four plan × scenario × boost row combinations of one study on one
 * compressor map (each its own colour, marker and dash) and in one table of differences.
 */
export function CompareView({
  document,
  mapsById,
  mapNames,
  selection,
  onSelectionChange,
}: {
  document: StudyDocument;
  mapsById: Record<string, SpoolbookMap | undefined>;
  mapNames: Record<string, string>;
  selection: readonly string[];
  onSelectionChange: (keys: string[]) => void;
}) {
  const system = useUnitSystem();
  const result = useMemo(() => runStudyLive(document, mapsById), [document, mapsById]);
  const drive = useMemo(() => studyDriveLive(document, result, mapsById), [document, result, mapsById]);
  const lines = useMemo(() => studyLines(result, document.plans), [result, document]);
  // Each plan judged over all its scenarios and boost rows: a line is only as good as its plan.
  const verdicts = useMemo(() => new Map(planVerdicts(result).map((v) => [v.planIndex, v])), [result]);
  const combinations = useMemo(() => allCombinations(document), [document]);
  const chosenLines = useMemo(() => selection.flatMap((key) => lines.filter((l) => l.key === key)), [selection, lines]);
  const chosen = useMemo(
    () =>
      chosenLines.map((l, index): ChosenLine => {
        const c = combinations.find((x) => x.key === l.key);
        return {
          key: l.key,
          index,
          planName: l.line.planName,
          scenarioName: c?.scenarioName ?? l.line.scenarioName,
          rowLabel: c?.rowLabel ?? l.line.rowLabel,
          verdict: verdicts.get(l.planIndex),
        };
      }),
    [chosenLines, combinations, verdicts],
  );
  // The table reads what fits first (stable: the chosen order within one verdict); each line keeps its own colour and marker.
  const rankedChosen = useMemo(() => rankByVerdict(chosen), [chosen]);
  const rows = useMemo(
    () =>
      compareLines(
        rankedChosen.map((c) => {
          const line = chosenLines[c.index].line;
          return { ...line, planVerdict: c.verdict?.status ?? null, drive: drive?.byPlan[line.planIndex] ?? null };
        }),
      ),
    [rankedChosen, chosenLines, drive],
  );

  // The maps the chosen lines were read from, in the order of the lines.
  const usedMaps = useMemo(() => {
    const out: { mapId: string; map: CompressorMap; name: string; firstIndex: number }[] = [];
    chosenLines.forEach((l, i) => {
      const mapId = document.plans[l.planIndex]?.compressorMapId;
      const map = mapId ? compressorMap(mapsById[mapId]) : null;
      if (mapId && map && !out.some((m) => m.mapId === mapId)) out.push({ mapId, map, name: mapNames[mapId] ?? map.name, firstIndex: i });
    });
    return out;
  }, [chosenLines, document, mapsById, mapNames]);

  const [drawnChoice, setDrawnChoice] = useState<string | null>(null);
  const [showOtherEdges, setShowOtherEdges] = useState(true);
  const [flowAxis, setFlowAxis] = useState<'corrected' | 'volume'>('corrected');
  const drawn = usedMaps.find((m) => m.mapId === drawnChoice) ?? usedMaps[0] ?? null;
  const overlays: OverlaidMap[] = useMemo(
    () => (showOtherEdges ? usedMaps.filter((m) => m !== drawn).map((m) => ({ map: m.map, name: m.name, colour: planColour(m.firstIndex) })) : []),
    [showOtherEdges, usedMaps, drawn],
  );

  // Each chosen line gets its own colour, marker and dash: its place in the comparison picks them.
  const views = useMemo(() => mapLineViews(chosenLines).map((v, index) => ({ ...v, planIndex: index, scenarioIndex: index })), [chosenLines]);
  // The same marks against rpm: the chosen lines re-indexed like the map's.
  const curveLines = useMemo(() => chosenLines.map((l, index) => ({ ...l, planIndex: index, scenarioIndex: index })), [chosenLines]);
  const figure = useMemo(
    () => compareFigure({ map: drawn?.map ?? null, overlays, lines: views, flowAxis, unitSystem: system, height: MAP_HEIGHT }),
    [drawn, overlays, views, flowAxis, system],
  );

  // The turbine maps of the chosen lines whose plans have the exhaust side, one drawn at a time.
  const usedTurbineMaps = useMemo(() => {
    const out: { mapId: string; map: TurbineMap; name: string }[] = [];
    for (const l of chosenLines) {
      const plan = document.plans[l.planIndex];
      const loaded = plan?.exhaust && plan.turbineMapId ? mapsById[plan.turbineMapId] : undefined;
      if (plan?.turbineMapId && loaded?.kind === 'turbine' && !out.some((m) => m.mapId === plan.turbineMapId))
        out.push({ mapId: plan.turbineMapId, map: loaded, name: mapNames[plan.turbineMapId] ?? loaded.name });
    }
    return out;
  }, [chosenLines, document, mapsById, mapNames]);
  const [turbineChoice, setTurbineChoice] = useState<string | null>(null);
  const drawnTurbine = usedTurbineMaps.find((m) => m.mapId === turbineChoice) ?? usedTurbineMaps[0] ?? null;
  const turbineViews = useMemo(
    () => (drawnTurbine ? turbineLineViews(curveLines.filter((_l, i) => document.plans[chosenLines[i].planIndex]?.turbineMapId === drawnTurbine.mapId)) : []),
    [drawnTurbine, curveLines, chosenLines, document],
  );

  const references = usedMaps.map(
    (m) => `${m.name}: ${formatQuantity(m.map.reference.temperature, 'temperature', system)}, ${formatQuantity(m.map.reference.pressure, 'pressure', system)}`,
  );
  const referencesDiffer = new Set(usedMaps.map((m) => `${m.map.reference.temperature}|${m.map.reference.pressure}`)).size > 1;
  const noMapPlans = [
    ...new Set(chosenLines.filter((l) => !compressorMap(mapsById[document.plans[l.planIndex]?.compressorMapId ?? ''])).map((l) => l.line.planName)),
  ];

  return (
    <div className="space-y-6">
      <StudyCaution />
      <Card title="What to compare">
        <CombinationPicker document={document} selected={selection} onToggle={(key) => onSelectionChange(toggleCombination(selection, key))} />
      </Card>

      {rankedChosen.length > 0 && (
        <Card title="Verdicts of the chosen lines’ plans">
          <ChosenVerdicts chosen={rankedChosen} />
        </Card>
      )}

      {chosenLines.length < MIN_COMBINATIONS ? (
        <Alert tone="info" title="Choose one more">
          Side by side needs at least two combinations. Tick another cell above.
        </Alert>
      ) : (
        <>
          <Card title="On the map">
            <div className="space-y-3">
              <div className="flex flex-wrap items-center gap-x-6 gap-y-2 text-sm">
                {usedMaps.length > 1 && (
                  <label className="flex min-w-0 max-w-full flex-wrap items-center gap-2">
                    <span className="font-semibold text-ink">Map drawn</span>
                    <select
                      value={drawn?.mapId ?? ''}
                      onChange={(e) => setDrawnChoice(e.target.value)}
                      className="max-w-full rounded-md border border-ink/25 bg-white px-2 py-1 text-sm"
                    >
                      {usedMaps.map((m) => (
                        <option key={m.mapId} value={m.mapId}>
                          {m.name}
                        </option>
                      ))}
                    </select>
                  </label>
                )}
                {usedMaps.length > 1 && (
                  <label className="flex items-center gap-2">
                    <input type="checkbox" className="size-4 accent-teal" checked={showOtherEdges} onChange={(e) => setShowOtherEdges(e.target.checked)} />
                    <span>Also draw the surge and choke lines of the other maps</span>
                  </label>
                )}
              </div>
              <ul className="flex flex-wrap gap-x-5 gap-y-1 text-sm" aria-label="Lines on the map">
                {chosen.map((c) => (
                  <li key={c.key} className="flex items-center gap-1.5">
                    <CombinationMark index={c.index} />
                    <span>
                      {c.planName} · {c.scenarioName} · {c.rowLabel}
                    </span>
                  </li>
                ))}
              </ul>
              <PlotFrame
                figure={figure}
                height={MAP_HEIGHT}
                label={drawn ? `Compressor map ${drawn.name} with the chosen operating lines` : 'The chosen operating lines'}
                exportName={`side-by-side${drawn ? `-${drawn.name}` : ''}`}
                controls={<FlowAxisSwitch value={flowAxis} onChange={setFlowAxis} />}
              />
              <p className="text-xs text-ink-soft">
                {drawn
                  ? usedMaps.length > 1
                    ? `The chosen lines use ${usedMaps.length} maps. ${drawn.name} is drawn in full${overlays.length ? '; the other maps’ surge lines are dotted and choke limits dash-dotted, in the colour of their first line' : ''}. Judge each line against its own map’s edges.`
                    : `All chosen lines are on ${drawn.name}.`
                  : 'No chosen line has a compressor map: the lines are drawn on plain axes.'}{' '}
                {referencesDiffer &&
                  `Corrected flow is measured against each map’s own reference (${references.join('; ')}), so positions across maps compare only roughly.`}
                {noMapPlans.length > 0 && ` ${noMapPlans.join(', ')} ${noMapPlans.length === 1 ? 'has' : 'have'} no map: no margins or shaft speed.`}
              </p>
            </div>
          </Card>

          {drawnTurbine && (
            <Card title="On the turbine map">
              <div className="space-y-3" data-testid="compare-turbine-map">
                {usedTurbineMaps.length > 1 && (
                  <label className="flex min-w-0 max-w-full flex-wrap items-center gap-2 text-sm">
                    <span className="font-semibold text-ink">Turbine map drawn</span>
                    <select
                      value={drawnTurbine.mapId}
                      onChange={(e) => setTurbineChoice(e.target.value)}
                      className="max-w-full rounded-md border border-ink/25 bg-white px-2 py-1 text-sm"
                    >
                      {usedTurbineMaps.map((m) => (
                        <option key={m.mapId} value={m.mapId}>
                          {m.name}
                        </option>
                      ))}
                    </select>
                  </label>
                )}
                <TurbineMapPlot map={drawnTurbine.map} lines={turbineViews} height={480} exportName={`side-by-side-${drawnTurbine.name}`} />
                <p className="text-xs text-ink-soft">
                  {usedTurbineMaps.length > 1
                    ? `The chosen lines run on ${usedTurbineMaps.length} turbine maps; each line is drawn on its own. Choose the map above.`
                    : `All chosen lines with the exhaust side run on ${drawnTurbine.name}.`}
                </p>
              </div>
            </Card>
          )}

          <Card title="Against engine speed">
            <div data-testid="compare-curves">
              <RpmCurves lines={curveLines} exportName="side-by-side" height={340} />
            </div>
          </Card>

          <Card title="Differences">
            <div className="space-y-3">
              <p className="text-sm text-ink-soft">
                Columns read what fits first. Margins are the smallest over the line (past a limit included: a negative one is the news), peaks the largest over
                the points the compressor can deliver, each with the engine speed it occurs at. The best value of each row is marked only among plans that fit,
                never on a value past a limit; “Best is” says what best means there. Counts are of points.
              </p>
              <DifferencesTable rows={rows} chosen={rankedChosen} />
            </div>
          </Card>
        </>
      )}
    </div>
  );
}
