/**
 * Candidates on the exhaust side: every turbine map (housing and A/R) of a library judged with a
 * chosen compressor, in the study's template plan with an exhaust side, then ranked: what fits
 * first, then the earliest boost threshold, the lowest peak drive pressure ratio, the smallest
 * wastegate share at peak power.
 */
import { VERDICT_RANK, planVerdicts } from '../matching/verdict';
import type { StudyDocument, StudyPlan } from '../schemas/study';
import type { SpoolbookMap, TurbineMap } from '../maps/types';
import { runStudyDocument, type MapModelCache } from '../study/run';
import { turbineCandidatePlan } from './plan';
import { candidateVerdict, extremeWhere, peakSpeeds, referenceLine, valueAtSpeed } from './readings';
import type { CandidateMap, TurbineCandidate, ValueWhere } from './types';

/** What every turbine candidate is judged with: the study, its template plan (with an exhaust side) and the chosen compressor. */
export interface TurbineRanking {
  doc: StudyDocument;
  template: StudyPlan;
  compressor: { id: string; map: SpoolbookMap };
}

/** One turbine map judged with the chosen compressor, as a plan with both would be. */
export function judgeTurbine(ranking: TurbineRanking, candidate: CandidateMap, cache?: MapModelCache): TurbineCandidate {
  if (candidate.map.kind !== 'turbine') throw new Error(`${candidate.name} is not a turbine map`);
  const map: TurbineMap = candidate.map;
  const plan = turbineCandidatePlan(ranking.template, ranking.compressor.id, candidate.id, map.housing, candidate.name.slice(0, 80));
  const result = runStudyDocument({ ...ranking.doc, plans: [plan] }, { [ranking.compressor.id]: ranking.compressor.map, [candidate.id]: map }, {}, cache);
  const [verdict] = planVerdicts(result);
  const fullLoad = result.lines.filter((l) => l.rowKind === 'full-load');
  let threshold: ValueWhere | null = null;
  let holdsAll = fullLoad.length > 0;
  let drive: ValueWhere | null = null;
  for (const line of result.lines) {
    const summary = line.exhaust;
    if (!summary) continue;
    const dpr = summary.peakDrivePressureRatio;
    if (dpr && (drive === null || dpr.value > drive.value))
      drive = { value: dpr.value, scenarioName: line.scenarioName, rowLabel: line.rowLabel, rpm: dpr.rpm };
    if (line.rowKind !== 'full-load') continue;
    const rpm = summary.boostThresholdRpm;
    if (rpm === null) holdsAll = false;
    else if (threshold === null || rpm > threshold.value) threshold = { value: rpm, scenarioName: line.scenarioName, rowLabel: line.rowLabel, rpm };
  }
  const reference = referenceLine(result.lines);
  const peakPower = peakSpeeds(reference).power;
  return {
    mapId: candidate.id,
    mapName: candidate.name,
    origin: candidate.origin,
    areaRatio: map.areaRatio,
    housing: map.housing,
    verdict: candidateVerdict(verdict),
    worstSurgeMargin: extremeWhere(result.lines, (v) => v.surgeMargin, 'least'),
    worstChokeMargin: extremeWhere(result.lines, (v) => v.chokeMargin, 'least'),
    worstSpeedMargin: extremeWhere(result.lines, (v) => v.speedMargin, 'least'),
    boostThreshold: holdsAll ? threshold : null,
    holdsEveryFullLoadLine: holdsAll,
    peakDrivePressureRatio: drive,
    wastegateShareAtPeakPower: peakPower === null ? null : valueAtSpeed(reference, peakPower, (v) => v.wastegateFraction),
  };
}

const lowFirst = (a: number | null | undefined, b: number | null | undefined) => (a == null ? (b == null ? 0 : 1) : b == null ? -1 : a - b);

/** Ranks turbine candidates: verdict, then boost threshold, peak drive pressure ratio, wastegate share at peak power, name. */
export function sortTurbineCandidates(list: readonly TurbineCandidate[]): TurbineCandidate[] {
  return [...list].sort(
    (a, b) =>
      VERDICT_RANK[a.verdict.status] - VERDICT_RANK[b.verdict.status] ||
      (a.verdict.status === 'does-not-fit' ? a.verdict.pointsAtLimit - b.verdict.pointsAtLimit : 0) ||
      lowFirst(a.boostThreshold?.value, b.boostThreshold?.value) ||
      lowFirst(a.peakDrivePressureRatio?.value, b.peakDrivePressureRatio?.value) ||
      lowFirst(a.wastegateShareAtPeakPower?.value, b.wastegateShareAtPeakPower?.value) ||
      a.mapName.localeCompare(b.mapName),
  );
}

/** Every turbine map of the list judged with the chosen compressor and ranked. */
export function rankTurbines(ranking: TurbineRanking, maps: readonly CandidateMap[], cache?: MapModelCache): TurbineCandidate[] {
  return sortTurbineCandidates(maps.filter((m) => m.map.kind === 'turbine').map((m) => judgeTurbine(ranking, m, cache)));
}
