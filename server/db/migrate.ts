import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { fileURLToPath } from 'node:url';
import type { Database } from './client';

/** The committed SQL migrations, found from this module's own location, not the working directory. */
const migrationsFolder = fileURLToPath(new URL('../../drizzle', import.meta.url));

// An arbitrary constant: every Spoolbook process takes this advisory lock around migrations,
// so two processes starting at once never apply the same migration twice.
const MIGRATION_LOCK = 727_101_2;

export async function runMigrations({ db, pool }: Database) {
  const client = await pool.connect();
  try {
    await client.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK]);
    try {
      await migrate(db, { migrationsFolder });
    } finally {
      await client.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK]);
    }
  } finally {
    client.release();
  }
}
