import type { SpoolbookMap } from '#shared/maps/types';
import type { StudyResult } from '#shared/matching';
import type { StudyDocument } from '#shared/schemas/study';
import { studyDriveWithMaps, type StudyDrive } from '#shared/drive/study-drive';
import { mapModelCache, runStudyDocument } from '#shared/study/run';

// The browser recomputes on every edit: it keeps one model per loaded map object and reuses it.
const cache = mapModelCache();

/** runStudyDocument with the plans' map models cached per map. */
export function runStudyLive(doc: StudyDocument, mapsById: Record<string, SpoolbookMap | undefined>): StudyResult {
  return runStudyDocument(doc, mapsById, {}, cache);
}

/** The drive figures of a study with a vehicle (null without one), on the same cached map models. */
export function studyDriveLive(doc: StudyDocument, result: StudyResult, mapsById: Record<string, SpoolbookMap | undefined>): StudyDrive | null {
  return studyDriveWithMaps(doc, result, mapsById, cache);
}
