import http from 'node:http';
import type { AddressInfo, Socket } from 'node:net';
import { pathToFileURL } from 'node:url';
import pino, { type Logger } from 'pino';
import type pg from 'pg';
import { loadConfig, type Config } from './config';
import { connectDatabase, type Database } from './db/client';
import { runMigrations } from './db/migrate';
import { createApp } from './app';
import { isDatabaseUnavailable } from './http/errors';
import { startFakeSmtp } from './mail/fake-smtp';
import { createMailer } from './mail/mailer';
import { enqueueMail, type MailWorker } from './mail/queue';
import { firstAdminMail } from './mail/templates';
import { FIRST_ADMIN_LINK_MINUTES, hasSiteAdmin, makeSiteAdmin } from './services/admins';
import type { LimitSettings } from './services/limits';

export interface RunningServer {
  /** The address people open (PUBLIC_URL). */
  url: string;
  /** Where this process listens, with the real port when PORT is 0. */
  address: string;
  server: http.Server;
  database: Database;
  /** Stops accepting, lets requests in flight finish (at most SHUTDOWN_GRACE_MS), closes mail and the pool. */
  stop: (signal?: string) => Promise<void>;
}

export interface StartOptions {
  /**
   * Stop on SIGTERM and SIGINT and then exit the process with status 0. On for the real server;
   * tests that run the server inside their own process turn it off and call `stop` themselves.
   */
  handleSignals?: boolean;
  logger?: Logger;
  /** How long to wait between attempts to reach the database at start-up, ms. */
  retryDelayMs?: number;
  /** Compute requests per client per minute (createApp's option); tests that send hundreds raise it. */
  computeRateLimitPerMinute?: number;
  /** Other limits (createApp's option); tests that upload hundreds of files raise them. */
  limitSettings?: Partial<LimitSettings>;
}

/** host:port/database of a PostgreSQL URL, for log lines: never the password. */
export function describeDatabase(url: string): string {
  try {
    const u = new URL(url);
    return `${u.hostname}:${u.port || '5432'}${u.pathname}`;
  } catch {
    return '(unparseable DATABASE_URL)';
  }
}

/**
 * Keeps a lost database connection from costing more than the request that was using it.
 *
 * pg emits 'error' on a client whose connection dies while it is checked out but between queries
 * (inside a transaction when PostgreSQL shuts down, say). The pool listens only while a client is
 * idle, and an unheard 'error' event would end the whole process. So every client gets a listener.
 *
 * drizzle-orm (0.45) sends BEGIN before its try/finally, so a transaction whose BEGIN fails on a
 * dying connection never gives its client back: each outage would leak pool slots until the pool
 * is exhausted and the server answers 503 for good. So a checked-out client whose connection dies
 * is handed back here, marked broken (the pool ends it and frees the slot), and the release its
 * borrower may still make later is ignored instead of throwing.
 */
export function guardPoolClients(pool: pg.Pool, logger: Logger) {
  const checkedOut = new Set<pg.PoolClient>();
  const reaped = new WeakSet<pg.PoolClient>();
  pool.on('acquire', (client) => checkedOut.add(client as pg.PoolClient));
  pool.on('release', (_err, client) => checkedOut.delete(client as pg.PoolClient));
  pool.on('remove', (client) => checkedOut.delete(client as pg.PoolClient));
  pool.on('connect', (raw) => {
    const client = raw as pg.PoolClient;
    // pg-pool assigns a fresh release function at every checkout: wrap each one as it is set.
    let release: pg.PoolClient['release'] = () => undefined;
    Object.defineProperty(client, 'release', {
      configurable: true,
      get: () => release,
      set: (fn: pg.PoolClient['release']) => {
        release = (err?: Error | boolean) => {
          if (reaped.has(client)) return;
          fn(err);
        };
      },
    });
    client.on('error', (err) => {
      logger.warn({ err: err.message }, 'database connection lost while in use');
      if (checkedOut.has(client) && !reaped.has(client)) {
        client.release(err);
        reaped.add(client);
      }
    });
  });
}

/** Starts Spoolbook: database (waiting for it), migrations, mail, HTTP; stops cleanly on SIGTERM. */
export async function startServer(config: Config = loadConfig(), options: StartOptions = {}): Promise<RunningServer> {
  const { handleSignals = true, retryDelayMs = 2000 } = options;
  const logger = options.logger ?? pino({ level: config.logLevel });
  const database = connectDatabase(config.databaseUrl, { onError: (err) => logger.warn({ err: err.message }, 'idle database connection lost') });
  guardPoolClients(database.pool, logger);

  // A SIGTERM while still waiting for the database ends the wait and the process, cleanly.
  let abandoned = false;
  const abandonStart = (signal: string) => {
    abandoned = true;
    logger.info({ signal }, 'stopping before start-up finished');
    // Nothing is served yet; a migration cut short rolls back in PostgreSQL.
    process.exit(0);
  };
  const earlySignals = handleSignals ? (['SIGTERM', 'SIGINT'] as const) : [];
  const earlyHandlers = earlySignals.map((s) => [s, () => abandonStart(s)] as const);
  for (const [s, h] of earlyHandlers) process.once(s, h);

  await waitForDatabase(database, config.databaseUrl, logger, retryDelayMs, () => abandoned);
  for (const [s, h] of earlyHandlers) process.removeListener(s, h);

  let smtpUrl = config.smtpUrl;
  let fakeSmtp: Awaited<ReturnType<typeof startFakeSmtp>> | null = null;
  if (!smtpUrl) {
    fakeSmtp = await startFakeSmtp(database.db, config.fakeSmtpPort);
    smtpUrl = `smtp://127.0.0.1:${fakeSmtp.port}`;
    logger.info({ port: fakeSmtp.port }, 'local fake SMTP server is catching mail into the outbox');
  }
  const mailer = createMailer(smtpUrl, config.mailFrom);
  const { app, deps } = createApp({
    database,
    config,
    mailer,
    logger,
    computeRateLimitPerMinute: options.computeRateLimitPerMinute,
    limitSettings: options.limitSettings,
  });
  if (config.firstAdmin) await ensureFirstAdmin(database, config, deps.mail, logger);

  let stopping = false;
  const inFlight = new Set<http.ServerResponse>();
  /** Requests under way on each open connection. */
  const connections = new Map<Socket, number>();
  // Node's closeIdleConnections leaves alone a connection that never sent a request (a browser's
  // speculative preconnect), which would hold a shutdown open for the whole grace period.
  const closeIdleConnections = () => {
    for (const [socket, active] of connections) if (active === 0) socket.destroy();
  };
  const server = http.createServer(
    {
      // Slow clients (headers or body trickled in) are cut off with 408 after these.
      requestTimeout: config.requestTimeoutMs,
      headersTimeout: config.headersTimeoutMs,
      // Node checks those timeouts only this often (30 s by default): check often enough to honour them.
      connectionsCheckingInterval: Math.max(50, Math.min(30_000, Math.floor(config.headersTimeoutMs / 4))),
    },
    (req, res) => {
      inFlight.add(res);
      const socket = req.socket;
      connections.set(socket, (connections.get(socket) ?? 0) + 1);
      res.once('close', () => {
        inFlight.delete(res);
        if (connections.has(socket)) connections.set(socket, Math.max(0, (connections.get(socket) ?? 1) - 1));
        if (stopping) setImmediate(closeIdleConnections);
      });
      if (stopping) res.setHeader('Connection', 'close');
      app(req, res);
    },
  );
  server.on('connection', (socket: Socket) => {
    connections.set(socket, 0);
    socket.once('close', () => connections.delete(socket));
  });
  server.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const port = (server.address() as AddressInfo).port;
  const address = `http://${config.host === '0.0.0.0' || config.host === '::' ? '127.0.0.1' : config.host}:${port}`;
  logger.info({ url: config.publicUrl, address }, 'Spoolbook is serving');

  let stopped: Promise<void> | null = null;
  const stop = (signal = 'stop') => {
    if (stopped) return stopped;
    stopping = true;
    logger.info({ signal, inFlight: inFlight.size, graceMs: config.shutdownGraceMs }, 'stopping: no new connections, finishing requests in flight');
    stopped = new Promise<void>((resolve) => {
      const force = setTimeout(() => {
        logger.warn({ inFlight: inFlight.size }, `requests still in flight after ${config.shutdownGraceMs} ms; closing their connections`);
        server.closeAllConnections();
        for (const socket of connections.keys()) socket.destroy();
      }, config.shutdownGraceMs);
      // Keep-alive connections must not hold the shutdown open: tell clients this connection ends
      // with the answer they are waiting for, and close each connection as soon as it goes idle.
      for (const res of inFlight) if (!res.headersSent) res.setHeader('Connection', 'close');
      server.close(async () => {
        clearTimeout(force);
        logger.info('HTTP server closed; closing mail and the database pool');
        deps.mail.stop();
        mailer.close();
        await fakeSmtp?.close().catch(() => undefined);
        // Bounded too: a client someone never gave back must not keep the process alive.
        const poolClosed = await Promise.race([
          database.pool.end().then(
            () => true,
            (err: Error) => (logger.warn({ err: err.message }, 'database pool did not close cleanly'), true),
          ),
          new Promise<false>((r) => setTimeout(() => r(false), 5_000).unref()),
        ]);
        if (poolClosed) logger.info('database pool closed; stopped');
        else
          logger.warn({ checkedOut: database.pool.totalCount - database.pool.idleCount }, 'database pool still had clients in use after 5 s; stopped anyway');
        resolve();
      });
      closeIdleConnections();
    });
    return stopped;
  };
  if (handleSignals) {
    const onSignal = (signal: string) => {
      void stop(signal).then(() => process.exit(0));
    };
    process.on('SIGTERM', () => onSignal('SIGTERM'));
    process.on('SIGINT', () => onSignal('SIGINT'));
  }
  return { url: config.publicUrl, address, server, database, stop };
}

/**
 * ADMIN_EMAIL: when the site has no admin yet, that address becomes one. A new account gets no
 * password anyone knows, only a one-time link to choose one, mailed to the address (never logged).
 */
async function ensureFirstAdmin(database: Database, config: Config, mail: MailWorker, logger: Logger) {
  const wanted = config.firstAdmin!;
  if (await hasSiteAdmin(database.db)) return;
  const { created, token } = await makeSiteAdmin(database.db, wanted.email, wanted.name);
  if (token) {
    await enqueueMail(database.db, firstAdminMail(wanted.email, `${config.publicUrl}/reset-password?token=${token}`, FIRST_ADMIN_LINK_MINUTES));
    mail.kick();
  }
  logger.info(
    { created },
    created ? 'first site admin made from ADMIN_EMAIL; a link to choose the password was mailed' : 'the account of ADMIN_EMAIL is now a site admin',
  );
}

/**
 * Waits until the database answers and the migrations are applied. A database that is down or
 * still starting is retried every `retryDelayMs` with a log line saying where and why; any
 * other failure of the migrations (a bad migration, say) ends start-up with that error.
 */
async function waitForDatabase(database: Database, url: string, logger: Logger, retryDelayMs: number, abandoned: () => boolean) {
  const where = describeDatabase(url);
  for (let attempt = 1; !abandoned(); attempt++) {
    let reachable = false;
    try {
      await database.pool.query('SELECT 1');
      reachable = true;
      await runMigrations(database);
      if (attempt > 1) logger.info({ database: where, attempt }, `database at ${where} is reachable; starting`);
      return;
    } catch (err) {
      if (reachable && !isDatabaseUnavailable(err)) throw err;
      const reason = (err as Error).message || String(err);
      logger.warn(
        { database: where, attempt, err: reason },
        `database at ${where} is not reachable yet (${reason}); retrying in ${Math.round(retryDelayMs / 100) / 10} s`,
      );
    }
    await new Promise((r) => setTimeout(r, retryDelayMs));
  }
  throw new Error('start-up abandoned');
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  startServer().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
