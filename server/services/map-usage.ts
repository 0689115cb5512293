import type { Db } from '../db/client';

/** The studies of a team whose plans use a map. Studies arrive with the studies feature. */
export async function studiesUsingMap(_db: Db, _teamId: string, _mapId: string): Promise<{ id: string; title: string }[]> {
  return [];
}
