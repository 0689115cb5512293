import { compressorModelFromMap } from '../maps';
import type { SpoolbookMap } from '../maps/types';
import { runStudy, type CompressorModel, type RunStudyOptions, type StudyResult } from '../matching';
import { toStudyInput, type StudyDocument } from '../schemas/study';

/** The compressor model of each plan, from the maps its plan names (null: no map, or not loaded). */
export function planCompressorModels(doc: StudyDocument, mapsById: Record<string, SpoolbookMap | undefined>): (CompressorModel | null)[] {
  return doc.plans.map((plan) => {
    const map = plan.compressorMapId ? mapsById[plan.compressorMapId] : undefined;
    return map && map.kind === 'compressor' ? compressorModelFromMap(map) : null;
  });
}

/**
 * Runs a valid study document with its maps: the one entry the study page, the shared view, the
 * report and the CSV export all use, so they always agree.
 */
export function runStudyDocument(
  doc: StudyDocument,
  mapsById: Record<string, SpoolbookMap | undefined>,
  options: Omit<RunStudyOptions, 'compressorModels'> = {},
): StudyResult {
  return runStudy(toStudyInput(doc), { validate: false, ...options, compressorModels: planCompressorModels(doc, mapsById) });
}
