import { z } from 'zod';
import { issuePath } from '#shared/schemas/issue-path';

const port = z.coerce.number().int().min(0).max(65535);
const LOOPBACK = new Set(['127.0.0.1', 'localhost', '::1']);

/** Every environment variable the server reads, checked once at start-up. See README "Configuration". */
const envSchema = z
  .object({
    DATABASE_URL: z.string().url('must be a postgres:// URL'),
    PORT: port.default(3000),
    HOST: z.string().default('127.0.0.1'),
    /** The address people open; links in e-mails start with it. */
    PUBLIC_URL: z.string().url().optional(),
    /** Comma-separated origins allowed to send state-changing requests (besides PUBLIC_URL's). */
    APP_ORIGIN: z.string().optional(),
    /** A real SMTP relay (smtp:// or smtps://). Unset: a local fake SMTP server stores mail in the outbox. */
    SMTP_URL: z.string().url().optional(),
    FAKE_SMTP_PORT: port.default(2526),
    MAIL_FROM: z.string().default('Spoolbook <no-reply@spoolbook.test>'),
    SESSION_IDLE_HOURS: z.coerce
      .number()
      .positive()
      .default(24 * 7),
    SESSION_ABSOLUTE_HOURS: z.coerce
      .number()
      .positive()
      .default(24 * 30),
    AUTH_RATE_LIMIT: z.coerce.number().int().positive().default(10),
    TRUST_PROXY: z.string().optional(),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    /** `development` only for `npm start` on its own local cluster: demo accounts and the unmasked outbox. */
    NODE_ENV: z.string().default('production'),
    /** The first site admin, made at start-up when there is none: this address gets a link to choose a password. */
    ADMIN_EMAIL: z.string().trim().toLowerCase().pipe(z.email('must be an e-mail address')).optional(),
    ADMIN_NAME: z.string().trim().min(1).max(80).default('Site admin'),
    CLIENT_DIR: z.string().optional(),
    /** Most time a client may take to send a whole request (headers and body), ms; slow clients are cut off. */
    REQUEST_TIMEOUT_MS: z.coerce.number().int().min(100).max(3_600_000).default(60_000),
    /** Most time a client may take to send the request headers, ms; at most REQUEST_TIMEOUT_MS. */
    HEADERS_TIMEOUT_MS: z.coerce.number().int().min(100).max(3_600_000).default(20_000),
    /** On SIGTERM, how long requests in flight may run before their connections are closed, ms. */
    SHUTDOWN_GRACE_MS: z.coerce.number().int().min(0).max(600_000).default(10_000),
  })
  .refine((e) => e.HEADERS_TIMEOUT_MS <= e.REQUEST_TIMEOUT_MS, {
    path: ['HEADERS_TIMEOUT_MS'],
    message: 'must be at most REQUEST_TIMEOUT_MS',
  })
  .refine((e) => e.NODE_ENV !== 'development' || LOOPBACK.has(e.HOST), {
    path: ['HOST'],
    message: 'development mode (demo accounts with published passwords, an unmasked outbox) serves on loopback only; use 127.0.0.1, or NODE_ENV=production',
  });

export interface Config {
  databaseUrl: string;
  port: number;
  host: string;
  publicUrl: string;
  allowedOrigins: string[];
  secureCookies: boolean;
  smtpUrl: string | null;
  fakeSmtpPort: number;
  mailFrom: string;
  sessionIdleMs: number;
  sessionAbsoluteMs: number;
  authRateLimit: number;
  trustProxy: string | false;
  logLevel: string;
  production: boolean;
  /** NODE_ENV=development: `npm start` on its own local cluster, loopback only. */
  development: boolean;
  /** The first site admin to make at start-up when there is none (ADMIN_EMAIL, ADMIN_NAME). */
  firstAdmin: { email: string; name: string } | null;
  clientDir: string | null;
  /** Node's server.requestTimeout, ms. */
  requestTimeoutMs: number;
  /** Node's server.headersTimeout, ms. */
  headersTimeoutMs: number;
  /** Bound on finishing requests in flight at shutdown, ms. */
  shutdownGraceMs: number;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${issuePath(i.path)}: ${i.message}`).join('\n');
    throw new Error(`Invalid configuration:\n${lines}`);
  }
  const e = parsed.data;
  const shownHost = e.HOST === '0.0.0.0' || e.HOST === '::' ? '127.0.0.1' : e.HOST;
  const publicUrl = (e.PUBLIC_URL ?? `http://${shownHost}:${e.PORT}`).replace(/\/$/, '');
  const allowedOrigins = new Set([new URL(publicUrl).origin]);
  allowedOrigins.add(`http://127.0.0.1:${e.PORT}`);
  allowedOrigins.add(`http://localhost:${e.PORT}`);
  for (const o of (e.APP_ORIGIN ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean))
    allowedOrigins.add(new URL(o).origin);
  return {
    databaseUrl: e.DATABASE_URL,
    port: e.PORT,
    host: e.HOST,
    publicUrl,
    allowedOrigins: [...allowedOrigins],
    secureCookies: publicUrl.startsWith('https:'),
    smtpUrl: e.SMTP_URL ?? null,
    fakeSmtpPort: e.FAKE_SMTP_PORT,
    mailFrom: e.MAIL_FROM,
    sessionIdleMs: e.SESSION_IDLE_HOURS * 3600_000,
    sessionAbsoluteMs: e.SESSION_ABSOLUTE_HOURS * 3600_000,
    authRateLimit: e.AUTH_RATE_LIMIT,
    trustProxy: e.TRUST_PROXY ?? false,
    logLevel: e.LOG_LEVEL,
    production: e.NODE_ENV === 'production',
    development: e.NODE_ENV === 'development',
    firstAdmin: e.ADMIN_EMAIL ? { email: e.ADMIN_EMAIL, name: e.ADMIN_NAME } : null,
    clientDir: e.CLIENT_DIR ?? null,
    requestTimeoutMs: e.REQUEST_TIMEOUT_MS,
    headersTimeoutMs: e.HEADERS_TIMEOUT_MS,
    shutdownGraceMs: e.SHUTDOWN_GRACE_MS,
  };
}
