import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pino, { type Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import { randomUUID } from 'node:crypto';
import { createLucia } from './auth/lucia';
import { sessionMiddleware } from './auth/session';
import type { AppDeps } from './app-deps';
import type { Config } from './config';
import type { Database } from './db/client';
import { jsonBody } from './http/body';
import { errorHandler, HttpError, notFoundHandler } from './http/errors';
import { requireSameOrigin } from './http/origin';
import type { Mailer } from './mail/mailer';
import { startMailWorker } from './mail/queue';
import { createLimits, defaultLimitSettings, type LimitSettings } from './services/limits';
import { adminRouter } from './routes/admin';
import { archiveRouter } from './routes/archive';
import { adminAuditRouter, teamAuditRouter } from './routes/audit';
import { authRouter } from './routes/auth';
import { candidateMapsRouter, candidatesRouter } from './routes/candidates';
import { computeRouter } from './routes/compute';
import { healthRouter } from './routes/health';
import { invitationsRouter } from './routes/invitations';
import { logPresetsRouter, logsRouter } from './routes/logs';
import { mapsRouter } from './routes/maps';
import { shareRouter } from './routes/share';
import { studiesRouter } from './routes/studies';
import { teamsRouter } from './routes/teams';
import { tracerRouter } from './routes/tracer';

export interface CreateAppOptions {
  database: Database;
  config: Config;
  mailer: Mailer;
  logger?: Logger;
  /** Compute requests per client per minute; only benchmarks raise it (50 users share one address there). */
  computeRateLimitPerMinute?: number;
  /** Other limits to change (tests lower them to reach them quickly). */
  limitSettings?: Partial<LimitSettings>;
  /** How often the mail worker looks at the queue, ms. */
  mailIntervalMs?: number;
  /** Starts every rate-limit key; tests give each app its own (server/services/limits.ts). */
  rateLimitNamespace?: string;
}

const defaultClientDir = fileURLToPath(new URL('../dist/client', import.meta.url));

/** Builds the whole app without listening, so tests can drive it with supertest. */
export function createApp({
  database,
  config,
  mailer,
  logger = pino({ level: config.logLevel }),
  computeRateLimitPerMinute,
  limitSettings,
  mailIntervalMs,
  rateLimitNamespace,
}: CreateAppOptions): { app: Express; deps: AppDeps } {
  const auth = createLucia(database.db, config);
  const settings: LimitSettings = {
    ...defaultLimitSettings(config.authRateLimit),
    ...(computeRateLimitPerMinute === undefined ? {} : { computePerMinute: computeRateLimitPerMinute }),
    ...limitSettings,
  };
  const limits = createLimits(database.pool, settings, rateLimitNamespace);
  const mail = startMailWorker(database.db, mailer, logger, mailIntervalMs);
  const deps: AppDeps = { db: database.db, pool: database.pool, config, mailer, logger, auth, limits, mail };
  const app = express();
  app.disable('x-powered-by');
  if (config.trustProxy) app.set('trust proxy', config.trustProxy);

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // React and the plotting library set inline styles.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          workerSrc: ["'self'", 'blob:'],
          objectSrc: ["'none'"],
          baseUri: ["'none'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: config.secureCookies ? [] : null,
        },
      },
      strictTransportSecurity: config.secureCookies,
    }),
  );
  // Study documents, map lists and CSVs are large and compress well; small answers are left alone.
  app.use(compression({ threshold: 2048 }));
  app.use(
    pinoHttp({
      logger,
      genReqId: (req, res) => {
        const id = randomUUID();
        res.setHeader('X-Request-Id', id);
        return id;
      },
      serializers: {
        req: (req) => ({ id: req.id, method: req.method, url: req.url }),
        res: (res) => ({ statusCode: res.statusCode }),
      },
    }),
  );

  const api = express.Router();
  // Our own JSON reader: refuses oversized, deeply nested and unstorable bodies early (server/http/body.ts).
  // Ids in paths are text: a NUL (which PostgreSQL cannot hold) names nothing that exists.
  api.use((req, _res, next) => next(/%00/.test(req.originalUrl) ? new HttpError(404, 'not_found', 'Not found.') : undefined));
  api.use(jsonBody());
  api.use(requireSameOrigin(config.allowedOrigins, auth.sessionCookieName));
  api.use(sessionMiddleware(auth, config.sessionAbsoluteMs, database.db));
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  api.use('/health', healthRouter(deps));
  api.use('/auth', authRouter(deps));
  api.use('/teams/:teamId', candidateMapsRouter(deps));
  api.use('/teams/:teamId/maps', mapsRouter(deps));
  api.use('/teams/:teamId/tracer', tracerRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/logs', logsRouter(deps));
  api.use('/teams/:teamId/log-presets', logPresetsRouter(deps));
  api.use('/teams/:teamId/studies/:studyId', candidatesRouter(deps));
  api.use('/teams/:teamId/studies', studiesRouter(deps));
  api.use('/share', shareRouter(deps));
  api.use('/teams/:teamId/audit', teamAuditRouter(deps));
  api.use('/teams/:teamId/archive', archiveRouter(deps));
  api.use('/admin/audit', adminAuditRouter(deps));
  api.use('/teams', teamsRouter(deps));
  api.use('/invitations', invitationsRouter(deps));
  api.use('/admin', adminRouter(deps));
  api.use('/compute', computeRouter(deps));
  api.use(notFoundHandler);
  app.use('/api', api);

  const clientDir = config.clientDir ?? defaultClientDir;
  if (existsSync(path.join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    // Every other GET is a client route: the single-page app decides what to show.
    app.get('/{*splat}', (_req, res) => {
      res.set('Cache-Control', 'no-cache');
      res.sendFile(path.join(clientDir, 'index.html'));
    });
  }
  app.use(errorHandler(logger));
  return { app, deps };
}
