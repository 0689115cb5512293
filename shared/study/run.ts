import { compressorModelFromMap, turbineModelFromMap } from '../maps';
import type { SpoolbookMap } from '../maps/types';
import { runStudy, type CompressorModel, type RunStudyOptions, type StudyResult, type TurbineModel } from '../matching';
import { toStudyInput, type StudyDocument } from '../schemas/study';

/** The compressor model of each plan, from the maps its plan names (null: no map, or not loaded). */
export function planCompressorModels(doc: StudyDocument, mapsById: Record<string, SpoolbookMap | undefined>): (CompressorModel | null)[] {
  return doc.plans.map((plan) => {
    const map = plan.compressorMapId ? mapsById[plan.compressorMapId] : undefined;
    return map && map.kind === 'compressor' ? compressorModelFromMap(map) : null;
  });
}

/** The turbine model of each plan, from the turbine map its plan names (null: none named, not loaded, or not a turbine map). */
export function planTurbineModels(doc: StudyDocument, mapsById: Record<string, SpoolbookMap | undefined>): (TurbineModel | null)[] {
  return doc.plans.map((plan) => {
    const id = plan.turbineMapId ?? null;
    const map = id ? mapsById[id] : undefined;
    return map && map.kind === 'turbine' ? turbineModelFromMap(map) : null;
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
): StudyResult {
  return runStudy(toStudyInput(doc), {
    validate: false,
    ...options,
    compressorModels: planCompressorModels(doc, mapsById),
    turbineModels: planTurbineModels(doc, mapsById),
  });
}
