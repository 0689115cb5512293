/**
 * Candidates: every compressor map of a library judged against one study's engine, scenarios and
 * boost schedules, each as a plan with that map would be (the same engine, the same verdict), then
 * ranked: what fits first, then by the order the builder chooses.
 */
import type { CompressorMap } from '../maps/types';
import { ISA_SEA_LEVEL_PRESSURE, ISA_SEA_LEVEL_TEMPERATURE } from '../physics/atmosphere';
import { VERDICT_RANK, planVerdicts } from '../matching/verdict';
import type { OperatingLine, StudyResult } from '../matching/result';
import type { StudyDocument, StudyPlan } from '../schemas/study';
import { runStudyDocument, type MapModelCache } from '../study/run';
import { compressorCandidatePlan } from './plan';
import { candidateVerdict, extremeWhere, peakSpeeds, referenceLine, valueAtSpeed } from './readings';
import type { CandidateMap, CompressorCandidate, LineTrace } from './types';

/** How candidates that share a verdict are ordered. */
export type CompressorOrder = 'smallest' | 'surge-margin' | 'efficiency' | 'outlet-temperature';

export const COMPRESSOR_ORDER_WORDS: Record<CompressorOrder, string> = {
  smallest: 'Smallest wheel that fits',
  'surge-margin': 'Widest worst surge margin',
  efficiency: 'Best efficiency over the full-load lines',
  'outlet-temperature': 'Lowest peak outlet temperature',
};

/** What every candidate of one study is judged with, worked out once. */
export interface CompressorRanking {
  doc: StudyDocument;
  template: StudyPlan;
  /** Peak torque and peak power speeds of the reference line, rpm, at the template plan's own efficiency (no map). */
  peakTorqueRpm: number | null;
  peakPowerRpm: number | null;
}

const runWithMap = (ranking: CompressorRanking, mapId: string | null, map: CompressorMap | null, cache?: MapModelCache): StudyResult =>
  runStudyDocument(
    { ...ranking.doc, plans: [compressorCandidatePlan(ranking.template, mapId, mapId ?? 'No map')] },
    map && mapId ? { [mapId]: map } : {},
    {},
    cache,
  );

/**
 * Prepares the ranking of a study against its template plan. The speeds of peak torque and power
 * are found once, without a map, so every candidate's efficiency is read at the same two speeds.
 */
export function compressorRanking(doc: StudyDocument, template: StudyPlan): CompressorRanking {
  const ranking: CompressorRanking = { doc, template, peakTorqueRpm: null, peakPowerRpm: null };
  const peaks = peakSpeeds(referenceLine(runWithMap(ranking, null, null).lines));
  return { ...ranking, peakTorqueRpm: peaks.torque, peakPowerRpm: peaks.power };
}

/** The wheel's size as its map tells it: the largest corrected flow of its choke line, at ISA sea-level reference, kg/s. */
export function mapCapacity(map: CompressorMap): number {
  const choke = map.curves.find((c) => c.kind === 'choke');
  const points = choke?.points.length ? choke.points : map.curves.flatMap((c) => c.points);
  const largest = Math.max(...points.map((p) => p.correctedMassFlow));
  // The same physical flow at two references: ṁc,0 = ṁc,ref·(p_ref/p_0)·√(T_0/T_ref)
  // (from ṁc = ṁ·√(T/T_ref)/(p/p_ref); NASA Glenn, "corrected airflow").
  return largest * (map.reference.pressure / ISA_SEA_LEVEL_PRESSURE) * Math.sqrt(ISA_SEA_LEVEL_TEMPERATURE / map.reference.temperature);
}

function traces(lines: readonly OperatingLine[]): LineTrace[] {
  return lines.map((line) => {
    const t: LineTrace = { scenarioIndex: line.scenarioIndex, rowIndex: line.rowIndex, flows: [], ratios: [], reachable: [] };
    for (const p of line.points) {
      if (!p.values) continue;
      t.flows.push(p.values.correctedMassFlow);
      t.ratios.push(p.values.pressureRatio);
      t.reachable.push(p.values.reachable !== false);
    }
    return t;
  });
}

function meanEfficiency(lines: readonly OperatingLine[]): number | null {
  let sum = 0;
  let n = 0;
  for (const line of lines) {
    if (line.rowKind !== 'full-load') continue;
    for (const p of line.points) {
      const eta = p.values?.reachable !== false ? p.values?.compressorEfficiency : null;
      if (eta != null) {
        sum += eta;
        n++;
      }
    }
  }
  return n > 0 ? sum / n : null;
}

/** One compressor map judged against the study, as a plan with that map would be. */
export function judgeCompressor(ranking: CompressorRanking, candidate: CandidateMap, cache?: MapModelCache): CompressorCandidate {
  if (candidate.map.kind !== 'compressor') throw new Error(`${candidate.name} is not a compressor map`);
  const map = candidate.map;
  const result = runWithMap(ranking, candidate.id, map, cache);
  const [verdict] = planVerdicts(result);
  const reference = referenceLine(result.lines);
  const eta = (v: { compressorEfficiency: number | null; reachable?: boolean }) => (v.reachable === false ? null : v.compressorEfficiency);
  return {
    mapId: candidate.id,
    mapName: candidate.name,
    origin: candidate.origin,
    verdict: candidateVerdict(verdict),
    worstSurgeMargin: extremeWhere(result.lines, (v) => v.surgeMargin, 'least'),
    worstChokeMargin: extremeWhere(result.lines, (v) => v.chokeMargin, 'least'),
    worstSpeedMargin: extremeWhere(result.lines, (v) => v.speedMargin, 'least'),
    efficiencyAtPeakTorque: ranking.peakTorqueRpm === null ? null : valueAtSpeed(reference, ranking.peakTorqueRpm, eta),
    efficiencyAtPeakPower: ranking.peakPowerRpm === null ? null : valueAtSpeed(reference, ranking.peakPowerRpm, eta),
    meanFullLoadEfficiency: meanEfficiency(result.lines),
    peakOutletTemperature: extremeWhere(result.lines, (v) => (v.reachable === false ? null : v.compressorOutletTemperature), 'most'),
    capacity: mapCapacity(map),
    traces: traces(result.lines),
  };
}

const missingLast = (a: number | null | undefined, b: number | null | undefined, better: 'low' | 'high') => {
  if (a == null && b == null) return 0;
  if (a == null) return 1;
  if (b == null) return -1;
  return better === 'low' ? a - b : b - a;
};

/**
 * Ranks candidates: fits, fits with warnings, not judged, does not fit; among those that do not fit,
 * fewer points at a limit first; then by the chosen order; then by name.
 */
export function sortCompressorCandidates(list: readonly CompressorCandidate[], order: CompressorOrder): CompressorCandidate[] {
  const key = (c: CompressorCandidate, other: CompressorCandidate): number => {
    switch (order) {
      case 'smallest':
        return c.capacity - other.capacity;
      case 'surge-margin':
        return missingLast(c.worstSurgeMargin?.value, other.worstSurgeMargin?.value, 'high');
      case 'efficiency':
        return missingLast(c.meanFullLoadEfficiency, other.meanFullLoadEfficiency, 'high');
      case 'outlet-temperature':
        return missingLast(c.peakOutletTemperature?.value, other.peakOutletTemperature?.value, 'low');
    }
  };
  return [...list].sort(
    (a, b) =>
      VERDICT_RANK[a.verdict.status] - VERDICT_RANK[b.verdict.status] ||
      (a.verdict.status === 'does-not-fit' ? a.verdict.pointsAtLimit - b.verdict.pointsAtLimit : 0) ||
      key(a, b) ||
      a.mapName.localeCompare(b.mapName),
  );
}

/** Every compressor map of the list judged and ranked (turbine maps are left out). */
export function rankCompressors(
  doc: StudyDocument,
  template: StudyPlan,
  maps: readonly CandidateMap[],
  order: CompressorOrder,
  cache?: MapModelCache,
): CompressorCandidate[] {
  const ranking = compressorRanking(doc, template);
  return sortCompressorCandidates(
    maps.filter((m) => m.map.kind === 'compressor').map((m) => judgeCompressor(ranking, m, cache)),
    order,
  );
}
