import * as mapsModule from '../../../shared/maps';
import type { CompressorMap, SpoolbookMap } from '../../../shared/maps/types';
import { runStudy, type CompressorModel, type RunStudyOptions, type StudyResult } from '../../../shared/matching';
import { toStudyInput, type StudyDocument } from '../../../shared/schemas/study';

// Building a map's model (triangulating its points) costs far more than solving the whole study,
// so the browser keeps one model per loaded map object and reuses it on every edit. Everything
// else is exactly runStudyDocument (shared/study/run.ts); a unit test holds the two equal.
const compressorModels = new WeakMap<CompressorMap, CompressorModel>();
const turbineModels = new WeakMap<object, unknown>();

// The exhaust side (turbine maps) is being added to the engine: use it when the maps module has it.
const turbineModelFromMap = (mapsModule as Record<string, unknown>).turbineModelFromMap as ((map: SpoolbookMap) => unknown) | undefined;

function compressorModelOf(map: SpoolbookMap | undefined): CompressorModel | null {
  if (!map || map.kind !== 'compressor') return null;
  let model = compressorModels.get(map);
  if (!model) {
    model = mapsModule.compressorModelFromMap(map);
    compressorModels.set(map, model);
  }
  return model;
}

function turbineModelOf(map: SpoolbookMap | undefined): unknown {
  if (!map || map.kind !== 'turbine' || !turbineModelFromMap) return null;
  let model = turbineModels.get(map);
  if (!model) {
    model = turbineModelFromMap(map);
    turbineModels.set(map, model);
  }
  return model;
}

/** The map ids a document's plans name: compressor maps, and turbine maps where a plan has one. */
export function studyMapIds(plans: readonly unknown[]): string[] {
  const ids: string[] = [];
  for (const plan of plans) {
    if (!plan || typeof plan !== 'object') continue;
    const { compressorMapId, turbineMapId } = plan as { compressorMapId?: unknown; turbineMapId?: unknown };
    if (typeof compressorMapId === 'string' && compressorMapId !== '') ids.push(compressorMapId);
    if (typeof turbineMapId === 'string' && turbineMapId !== '') ids.push(turbineMapId);
  }
  return ids;
}

/** runStudyDocument with the plans' map models cached per map. */
export function runStudyLive(doc: StudyDocument, mapsById: Record<string, SpoolbookMap | undefined>): StudyResult {
  const options: Record<string, unknown> = {
    validate: false,
    compressorModels: doc.plans.map((plan) => (plan.compressorMapId ? compressorModelOf(mapsById[plan.compressorMapId]) : null)),
  };
  if (turbineModelFromMap) {
    options.turbineModels = doc.plans.map((plan) => {
      const id = (plan as { turbineMapId?: string | null }).turbineMapId ?? null;
      return id ? turbineModelOf(mapsById[id]) : null;
    });
  }
  return runStudy(toStudyInput(doc), options as RunStudyOptions);
}
