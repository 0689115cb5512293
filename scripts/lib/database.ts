import { connectDatabase } from '#server/db/client';
import { runMigrations } from '#server/db/migrate';
import { seedDemo } from '#server/services/demo';
import { ensureDatabase, ensureLocalCluster } from './postgres';

/**
 * The database URL to use: DATABASE_URL's server when set (no local cluster is started),
 * otherwise the local cluster under .data/. `database` names the database on that server.
 * `demo` seeds the demo team and its accounts with published passwords: only for development
 * (`npm start` on its own cluster) and the test and bench databases, never otherwise.
 */
export async function prepareDatabase(root: string, { database, fresh = false, demo = false }: { database?: string; fresh?: boolean; demo?: boolean }) {
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
    if (demo) await seedDemo(db.db);
  } finally {
    await db.pool.end();
  }
  return url;
}
