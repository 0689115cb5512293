import type { Logger } from 'pino';
import type { Auth } from './auth/lucia';
import type { Config } from './config';
import type { Database, Db } from './db/client';
import type { Mailer } from './mail/mailer';
import type { MailWorker } from './mail/queue';
import type { Limits } from './services/limits';

/**
 * What every router is built from. In a module of its own so that server/app.ts (which builds the
 * routers) and the routers (which take these) never import each other.
 */
export interface AppDeps {
  db: Db;
  pool: Database['pool'];
  config: Config;
  mailer: Mailer;
  logger: Logger;
  auth: Auth;
  /** Every rate limit, counted in PostgreSQL (shared by all instances). */
  limits: Limits;
  /** This process's sender of queued mail, and work done after answering. */
  mail: MailWorker;
}
