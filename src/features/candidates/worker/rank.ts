/**
 * The ranking itself, map by map with progress: run in the worker (rank.worker.ts), and in Node by
 * the benchmark. Sorting is left to the caller, so that changing the order needs no new run.
 */
import { compressorRanking, judgeCompressor, judgeTurbine, templatePlan, type CompressorCandidate, type TurbineCandidate } from '#shared/candidates';
import { mapModelCache, type MapModelCache } from '#shared/study/run';
import type { RankRequest } from './protocol';

export function rankInSteps(
  request: RankRequest,
  onProgress: (done: number, total: number) => void,
  cache: MapModelCache = mapModelCache(),
): { compressors: CompressorCandidate[]; turbines: TurbineCandidate[] } {
  const maps = request.maps.filter((m) => m.map.kind === request.kind);
  const total = maps.length;
  onProgress(0, total);
  if (request.kind === 'compressor') {
    const template = templatePlan(request.doc, 'compressor', request.templateId) ?? request.doc.plans[0];
    const ranking = compressorRanking(request.doc, template);
    const compressors = maps.map((m, i) => {
      const row = judgeCompressor(ranking, m, cache);
      onProgress(i + 1, total);
      return row;
    });
    return { compressors, turbines: [] };
  }
  const template = templatePlan(request.doc, 'turbine', request.templateId);
  if (!template)
    throw new Error('This study has no plan with an exhaust side: turn it on for a plan first (its gates, temperatures and losses judge every housing).');
  const turbines = maps.map((m, i) => {
    const row = judgeTurbine({ doc: request.doc, template, compressor: request.compressor }, m, cache);
    onProgress(i + 1, total);
    return row;
  });
  return { compressors: [], turbines };
}
