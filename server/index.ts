import pino from 'pino';
import { loadConfig, type Config } from './config';
import { pathToFileURL } from 'node:url';
import { connectDatabase } from './db/client';
import { runMigrations } from './db/migrate';
import { createApp } from './app';
import { startFakeSmtp } from './mail/fake-smtp';
import { createMailer } from './mail/mailer';

export interface RunningServer {
  url: string;
  stop: (signal?: string) => void;
}

/** Starts Spoolbook: database (waiting for it), migrations, mail, HTTP; stops cleanly on SIGTERM. */
export async function startServer(config: Config = loadConfig()): Promise<RunningServer> {
  const logger = pino({ level: config.logLevel });
  const database = connectDatabase(config.databaseUrl, { onError: (err) => logger.warn({ err: err.message }, 'idle database connection lost') });

  for (let attempt = 1; ; attempt++) {
    try {
      await database.pool.query('SELECT 1');
      break;
    } catch (err) {
      logger.warn({ attempt, err: (err as Error).message }, 'database not reachable yet; retrying in 2 s');
      await new Promise((r) => setTimeout(r, 2000));
    }
  }
  await runMigrations(database);

  let smtpUrl = config.smtpUrl;
  let fakeSmtp: Awaited<ReturnType<typeof startFakeSmtp>> | null = null;
  if (!smtpUrl) {
    fakeSmtp = await startFakeSmtp(database.db, config.fakeSmtpPort);
    smtpUrl = `smtp://127.0.0.1:${fakeSmtp.port}`;
    logger.info({ port: fakeSmtp.port }, 'local fake SMTP server is catching mail into the outbox');
  }
  const mailer = createMailer(smtpUrl, config.mailFrom);
  const { app } = createApp({ database, config, mailer, logger });

  const server = app.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  logger.info({ url: config.publicUrl }, 'Spoolbook is serving');
  server.requestTimeout = 60_000;
  server.headersTimeout = 20_000;

  let stopping = false;
  const stop = (signal = 'stop') => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'stopping: no new connections, finishing requests in flight');
    const force = setTimeout(() => {
      logger.warn('requests still in flight after 10 s; closing them');
      server.closeAllConnections();
    }, 10_000);
    force.unref();
    server.close(async () => {
      mailer.close();
      await fakeSmtp?.close();
      await database.pool.end();
      logger.info('stopped');
      process.exit(0);
    });
    server.closeIdleConnections();
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
  return { url: config.publicUrl, stop };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  startServer().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
