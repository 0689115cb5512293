import type { SpoolbookMap } from '#shared/maps/types';
import type { StudyResult } from '#shared/matching';
import type { StudyDocument } from '#shared/schemas/study';
import { mapModelCache, runStudyDocument } from '#shared/study/run';

// The browser recomputes on every edit: it keeps one model per loaded map object and reuses it.
const cache = mapModelCache();

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
  return runStudyDocument(doc, mapsById, {}, cache);
}
