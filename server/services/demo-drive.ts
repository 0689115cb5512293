/**
 * The demo studies' invented cars, so that a new user sees drive figures without typing a car in:
 * a front-drive hatch on the compressor study and a rear-drive coupé on the turbine housing one.
 * Added once as a revision of each demo study that has no vehicle yet.
 */
import { and, eq, sql } from 'drizzle-orm';
import type { Vehicle } from '#shared/drive/vehicle';
import type { Db } from '../db/client';
import { studies, studyRevisions } from '../db/schema';
import { DEMO_STUDY_FILES, validDocument } from './study-documents';

/** Invented cars (demo data), by demo study file. */
export const DEMO_VEHICLES: Record<string, Vehicle> = {
  [DEMO_STUDY_FILES.compressor]: {
    mass: 1080,
    drivenAxle: 'front',
    drivenAxleWeightShare: 0.62,
    cgHeight: 0.5,
    wheelbase: 2.55,
    tyreRadius: 0.305,
    grip: 1.1,
    gearRatios: [3.25, 2.05, 1.46, 1.12],
    finalDrive: 4.2,
    shiftRpm: 7800,
    shiftTime: 0.15,
    dragArea: 0.65,
    rollingResistance: 0.013,
    spool: { gear: 3, startRpm: 4500 },
    launchRpm: 4500,
    runSpeed: 100 / 3.6,
    rotors: [
      { planId: 'plan-s44', wheelDiameter: 0.044 },
      { planId: 'plan-m58', wheelDiameter: 0.058 },
      { planId: 'plan-l76', wheelDiameter: 0.076 },
    ],
  },
  [DEMO_STUDY_FILES.turbineHousing]: {
    mass: 1150,
    drivenAxle: 'rear',
    drivenAxleWeightShare: 0.52,
    cgHeight: 0.48,
    wheelbase: 2.45,
    tyreRadius: 0.31,
    grip: 1.1,
    gearRatios: [3.1, 2.0, 1.45, 1.12],
    finalDrive: 4.1,
    shiftRpm: 7800,
    shiftTime: 0.2,
    dragArea: 0.62,
    rollingResistance: 0.013,
    spool: { gear: 3, startRpm: 4500 },
    launchRpm: 4500,
    runSpeed: 100 / 3.6,
    rotors: [
      { planId: 'plan-single', wheelDiameter: 0.058 },
      { planId: 'plan-divided', wheelDiameter: 0.058 },
    ],
  },
};

/** Gives each demo study (by title) its car, as a new revision by the demo user, where it has none. Idempotent. */
export async function addDemoVehicles(db: Db, teamId: string, titles: { title: string; file: string }[], userId: string) {
  for (const { title, file } of titles) {
    const vehicle = DEMO_VEHICLES[file];
    const [row] = await db
      .select({ id: studies.id, document: studies.document, revision: studies.revision })
      .from(studies)
      .where(and(eq(studies.teamId, teamId), eq(studies.title, title)));
    if (!row || !vehicle || (row.document as { vehicle?: unknown }).vehicle !== undefined) continue;
    const document = validDocument({ ...validDocument(row.document), vehicle });
    await db.transaction(async (tx) => {
      const [saved] = await tx
        .update(studies)
        .set({ document, revision: sql`${studies.revision} + 1`, updatedBy: userId, updatedAt: new Date() })
        .where(and(eq(studies.id, row.id), eq(studies.revision, row.revision)))
        .returning({ revision: studies.revision, title: studies.title });
      if (saved)
        await tx
          .insert(studyRevisions)
          .values({ studyId: row.id, revision: saved.revision, document, title: saved.title, message: 'Demo car added', authorId: userId });
    });
  }
}
