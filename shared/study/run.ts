import { compressorModelFromMap, turbineModelFromMap } from '../maps';
import type { CompressorMap, SpoolbookMap, TurbineMap } from '../maps/types';
import type { CompressorModel } from '../matching/compressor/model';
import type { TurbineModel } from '../matching/exhaust/model';
import { finding } from '../matching/finding';
import type { StudyResult } from '../matching/result';
import { runStudy, type RunStudyOptions } from '../matching/run-study';
import { toStudyInput, type StudyDocument } from '../schemas/study';

/**
 * Map models kept per map object. Building a model (triangulating a map's points) costs far more
 * than solving a whole study, so a caller that recomputes on every edit (the study page) keeps one
 * cache and passes it each time.
 */
export interface MapModelCache {
  compressor: WeakMap<CompressorMap, CompressorModel>;
  turbine: WeakMap<TurbineMap, TurbineModel>;
}

export function mapModelCache(): MapModelCache {
  return { compressor: new WeakMap(), turbine: new WeakMap() };
}

function cached<M extends object, T>(cache: WeakMap<M, T> | undefined, map: M, build: (map: M) => T): T {
  let model = cache?.get(map);
  if (!model) {
    model = build(map);
    cache?.set(map, model);
  }
  return model;
}

/** The compressor model of each plan, from the maps its plan names (null: no map, or not loaded). */
export function planCompressorModels(
  doc: StudyDocument,
  mapsById: Record<string, SpoolbookMap | undefined>,
  cache?: MapModelCache,
): (CompressorModel | null)[] {
  return doc.plans.map((plan) => {
    const map = plan.compressorMapId ? mapsById[plan.compressorMapId] : undefined;
    return map && map.kind === 'compressor' ? cached(cache?.compressor, map, (m) => compressorModelFromMap(m)) : null;
  });
}

/** The turbine model of each plan, from the turbine map its plan names (null: none named, not loaded, or not a turbine map). */
export function planTurbineModels(doc: StudyDocument, mapsById: Record<string, SpoolbookMap | undefined>, cache?: MapModelCache): (TurbineModel | null)[] {
  return doc.plans.map((plan) => {
    const id = plan.turbineMapId ?? null;
    const map = id ? mapsById[id] : undefined;
    return map && map.kind === 'turbine' ? cached(cache?.turbine, map, turbineModelFromMap) : null;
  });
}

/**
 * Runs a valid study document with its maps: the one entry the study page, the shared view, the
 * report and the CSV export all use, so they always agree.
 */
export function runStudyDocument(
  doc: StudyDocument,
  mapsById: Record<string, SpoolbookMap | undefined>,
  options: Omit<RunStudyOptions, 'compressorModels' | 'turbineModels'> = {},
  cache?: MapModelCache,
): StudyResult {
  const result = runStudy(toStudyInput(doc), {
    ...options,
    compressorModels: planCompressorModels(doc, mapsById, cache),
    turbineModels: planTurbineModels(doc, mapsById, cache),
  });
  noteEstimatedMaps(doc, mapsById, result);
  return result;
}

/**
 * A plan judged on an estimated compressor map (made from another by a family rule) says so in its
 * findings: once per line, on its first solved point, as a note the verdict does not count.
 */
function noteEstimatedMaps(doc: StudyDocument, mapsById: Record<string, SpoolbookMap | undefined>, result: StudyResult): void {
  for (const line of result.lines) {
    const id = doc.plans[line.planIndex]?.compressorMapId;
    const map = id ? mapsById[id] : undefined;
    if (map?.kind !== 'compressor' || !map.estimate) continue;
    const point = line.points.find((p) => p.solved);
    if (!point) continue;
    point.findings.push(
      finding(
        'map-estimate',
        'info',
        `The compressor map “${map.name}” is an estimate made from “${map.estimate.parentName}” by ${map.estimate.rule}, not a measured map: confirm the wheel on its maker's map before buying.`,
        point.rpm,
      ),
    );
    line.worstSeverity ??= 'info';
  }
}
