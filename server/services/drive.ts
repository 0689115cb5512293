/** A study's drive downloads (drive.csv, spool.csv), computed from its latest revision. */
import { driveCsv, spoolCsv } from '#shared/drive/csv';
import { studyDriveWithMaps } from '#shared/drive/study-drive';
import { runStudyDocument } from '#shared/study/run';
import type { Db } from '../db/client';
import { HttpError } from '../http/errors';
import { loadStudy } from './studies';
import { mapsOfStudy, validDocument } from './study-documents';

/** The drive figures of a team's study as CSV, with the revision they come from; 409 when the study has no vehicle. */
export async function studyDriveCsv(db: Db, teamId: string, studyId: string, which: 'drive' | 'spool') {
  const { study } = await loadStudy(db, teamId, studyId);
  const document = validDocument(study.document);
  if (!document.vehicle)
    throw new HttpError(409, 'no_vehicle', 'This study has no vehicle, so it has no drive figures: add the car in the Drive view of the study first.');
  const maps = await mapsOfStudy(db, teamId, document);
  const drive = studyDriveWithMaps(document, runStudyDocument(document, maps), maps)!;
  return { csv: which === 'drive' ? driveCsv(drive) : spoolCsv(drive), revision: study.revision };
}
