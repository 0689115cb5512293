import { compressorModelFromMap } from '../../../shared/maps';
import type { CompressorMap, SpoolbookMap } from '../../../shared/maps/types';
import { runStudy, type CompressorModel, type StudyResult } from '../../../shared/matching';
import { toStudyInput, type StudyDocument } from '../../../shared/schemas/study';

// Building a compressor model from a map (triangulating its points) costs far more than solving
// the whole study, so the browser keeps one model per loaded map object and reuses it on every
// edit. Everything else is exactly runStudyDocument (shared/study/run.ts).
const models = new WeakMap<CompressorMap, CompressorModel>();

function modelOf(map: SpoolbookMap | undefined): CompressorModel | null {
  if (!map || map.kind !== 'compressor') return null;
  let model = models.get(map);
  if (!model) {
    model = compressorModelFromMap(map);
    models.set(map, model);
  }
  return model;
}

/** runStudyDocument with the plans' compressor models cached per map. */
export function runStudyLive(doc: StudyDocument, mapsById: Record<string, SpoolbookMap | undefined>): StudyResult {
  const compressorModels = doc.plans.map((plan) => (plan.compressorMapId ? modelOf(mapsById[plan.compressorMapId]) : null));
  return runStudy(toStudyInput(doc), { validate: false, compressorModels });
}
