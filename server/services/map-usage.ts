import { and, eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { studies } from '../db/schema';

/** The studies of a team whose plans use a map (archived ones too: they may be restored). */
export async function studiesUsingMap(db: Db, teamId: string, mapId: string): Promise<{ id: string; title: string }[]> {
  const probe = JSON.stringify([{ compressorMapId: mapId }]);
  return db
    .select({ id: studies.id, title: studies.title })
    .from(studies)
    .where(and(eq(studies.teamId, teamId), sql`${studies.document} -> 'plans' @> ${probe}::jsonb`))
    .orderBy(studies.title);
}
