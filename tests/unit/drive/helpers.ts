/** The demo studies with their invented cars, their maps and results, for the drive tests. */
import { builtinMap } from '#server/services/builtin-maps';
import { DEMO_VEHICLES } from '#server/services/demo-drive';
import { DEMO_STUDY_FILES, demoStudyDocument, validDocument } from '#server/services/study-documents';
import type { Vehicle } from '#shared/drive/vehicle';
import type { SpoolbookMap } from '#shared/maps/types';
import type { StudyDocument } from '#shared/schemas/study';
import { studyMapIds } from '#shared/study/document';
import { mapModelCache, planCompressorModels, planTurbineModels, runStudyDocument } from '#shared/study/run';

export type DemoKind = keyof typeof DEMO_STUDY_FILES;

/** A demo study with its demo car, or with `vehicle` changed as given. */
export function demoDriveDocument(kind: DemoKind, change: Partial<Vehicle> = {}): StudyDocument {
  const file = DEMO_STUDY_FILES[kind];
  return validDocument({ ...demoStudyDocument(file), vehicle: { ...DEMO_VEHICLES[file], ...change } });
}

/** The document's maps, result and models, as the study page computes them. */
export function computed(doc: StudyDocument) {
  const maps: Record<string, SpoolbookMap> = Object.fromEntries(studyMapIds(doc.plans).map((id) => [id, builtinMap(id)!.map]));
  const cache = mapModelCache();
  const result = runStudyDocument(doc, maps, {}, cache);
  return { maps, result, models: { compressorModels: planCompressorModels(doc, maps, cache), turbineModels: planTurbineModels(doc, maps, cache) } };
}
