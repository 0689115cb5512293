import type { Database } from '../db/client';

/** Whether the database answers a trivial query now. */
export async function databaseStatus(pool: Database['pool']): Promise<'up' | 'down'> {
  try {
    await pool.query('SELECT 1');
    return 'up';
  } catch {
    return 'down';
  }
}
