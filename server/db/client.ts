import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from './schema';

export type Db = NodePgDatabase<typeof schema>;
/** The handle a `db.transaction` callback gets: the same queries, inside that transaction. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export interface Database {
  db: Db;
  pool: pg.Pool;
}

/** One pool per process. Errors on idle clients (the server restarting) are logged, not fatal. */
export function connectDatabase(url: string, { max = 10, onError }: { max?: number; onError?: (err: Error) => void } = {}): Database {
  const pool = new pg.Pool({ connectionString: url, max, connectionTimeoutMillis: 5_000, idleTimeoutMillis: 30_000 });
  pool.on('error', (err) => onError?.(err));
  return { db: drizzle(pool, { schema }), pool };
}
