import { connectDatabase } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed';
import { ensureDatabase, ensureLocalCluster } from './postgres';

/**
 * The database URL to use: DATABASE_URL's server when set (no local cluster is started),
 * otherwise the local cluster under .data/. `database` names the database on that server.
 */
export async function prepareDatabase(root: string, { database, fresh = false }: { database?: string; fresh?: boolean }) {
  let url: string;
  if (process.env.DATABASE_URL) {
    const given = new URL(process.env.DATABASE_URL);
    if (database) {
      await ensureDatabase(given.toString(), database, { fresh });
      given.pathname = `/${database}`;
    }
    url = given.toString();
  } else {
    const cluster = ensureLocalCluster(root);
    const name = database ?? 'spoolbook';
    await ensureDatabase(cluster.url('postgres'), name, { fresh });
    url = cluster.url(name);
  }
  const db = connectDatabase(url, { max: 2 });
  try {
    await runMigrations(db);
    await seedDemo(db.db);
  } finally {
    await db.pool.end();
  }
  return url;
}
