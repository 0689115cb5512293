import type { RequestHandler } from 'express';
import type pg from 'pg';
import { RateLimiterMemory, RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { HttpError } from '../http/errors';

/**
 * Every rate limit of the app, counted in PostgreSQL (the `rate_limits` table, rate-limiter-flexible's
 * PostgreSQL store), so the limits hold across any number of server instances and restarts.
 * See docs/decisions/002-throttling-store-and-hashed-sessions.md.
 */
export interface LimitSettings {
  /** Failed sign-ins (and second-factor codes) on one account, from anywhere, before delays begin. */
  signInFreeFailures: number;
  /** Failed sign-ins from one address, on any accounts, before delays begin. */
  signInFreeFailuresPerAddress: number;
  /** Sign-ups from one address per 15 minutes. */
  signUpsPerAddress: number;
  /** Reset requests from one address per 15 minutes. */
  resetsPerAddress: number;
  /** Reset mails to one account per hour (more requests answer the same, and send nothing). */
  resetsPerAccount: number;
  /** Confirmation mails to one account per hour. */
  confirmationsPerAccount: number;
  /** Compute requests per address per minute. */
  computePerMinute: number;
  /** Invitations and resends per team per hour. */
  invitationsPerTeam: number;
  /** Invitations and resends by one user per hour, over all their teams. */
  invitationsPerUser: number;
  /** Invitation mails to one address per hour, from any team. */
  invitationsPerAddress: number;
  /** Uploads (maps, pictures, archives) by one user per hour. */
  uploadsPerUser: number;
}

export function defaultLimitSettings(authRateLimit: number): LimitSettings {
  return {
    signInFreeFailures: authRateLimit,
    signInFreeFailuresPerAddress: authRateLimit * 5,
    signUpsPerAddress: authRateLimit,
    resetsPerAddress: authRateLimit,
    resetsPerAccount: 3,
    confirmationsPerAccount: 3,
    computePerMinute: 300,
    invitationsPerTeam: 20,
    invitationsPerUser: 40,
    invitationsPerAddress: 5,
    uploadsPerUser: 120,
  };
}

const TABLE = 'rate_limits';
const MINUTE = 60;
const HOUR = 3600;

/**
 * Growing delays instead of a lockout: after `free` failures within the window, each further
 * failure makes the next attempt wait twice as long as the last (1 s, 2 s, 4 s …, at most
 * `maxDelaySeconds`). The real user is slowed for a while, never shut out; a success clears it.
 */
class GrowingDelay {
  private readonly failures: RateLimiterPostgres;
  private readonly wait: RateLimiterPostgres;

  constructor(
    pool: pg.Pool,
    name: string,
    private readonly free: number,
    private readonly maxDelaySeconds: number,
    windowSeconds: number,
  ) {
    const common = { storeClient: pool, storeType: 'pool', tableName: TABLE, tableCreated: true, clearExpiredByTimeout: false };
    this.failures = new RateLimiterPostgres({ ...common, keyPrefix: `${name}-failures`, points: 1_000_000, duration: windowSeconds });
    this.wait = new RateLimiterPostgres({ ...common, keyPrefix: `${name}-wait`, points: 1, duration: maxDelaySeconds });
  }

  /** Milliseconds before the next attempt is allowed; 0 when it is allowed now. */
  async waitMs(key: string): Promise<number> {
    const res = await this.wait.get(key);
    return res && res.consumedPoints > 1 ? Math.max(1, res.msBeforeNext) : 0;
  }

  async failed(key: string): Promise<void> {
    const res = await this.failures.penalty(key, 1);
    const beyond = res.consumedPoints - this.free;
    if (beyond > 0) await this.wait.block(key, Math.min(this.maxDelaySeconds, 2 ** Math.min(beyond - 1, 30)));
  }

  async succeeded(key: string): Promise<void> {
    await Promise.all([this.failures.delete(key), this.wait.delete(key)]);
  }
}

/** A plain count per key and window; past it, 429 with Retry-After. */
class Quota {
  private readonly limiter: RateLimiterPostgres;

  constructor(
    pool: pg.Pool,
    name: string,
    points: number,
    windowSeconds: number,
    private readonly message: string,
    clearsTable = false,
  ) {
    // The table is shared: one limiter deleting expired rows (every 5 minutes) serves them all.
    // While PostgreSQL is unreachable this process counts in memory instead (the library's
    // "insurance" limiter), so open routes such as compute keep working and stay limited.
    this.limiter = new RateLimiterPostgres({
      storeClient: pool,
      storeType: 'pool',
      tableName: TABLE,
      tableCreated: true,
      clearExpiredByTimeout: clearsTable,
      keyPrefix: name,
      points,
      duration: windowSeconds,
      insuranceLimiter: new RateLimiterMemory({ keyPrefix: name, points, duration: windowSeconds }),
    });
  }

  /** Counts one; throws 429 when the quota was used up. */
  async take(key: string): Promise<void> {
    const left = await this.tryTake(key);
    if (left !== true) throw tooMany(this.message, left);
  }

  /** Counts one; true when within the quota, else the milliseconds until it frees up. */
  async tryTake(key: string): Promise<true | number> {
    try {
      await this.limiter.consume(key, 1);
      return true;
    } catch (err) {
      if (err instanceof RateLimiterRes) return err.msBeforeNext;
      throw err;
    }
  }
}

export function tooMany(message: string, waitMs: number): HttpError {
  const seconds = Math.max(1, Math.ceil(waitMs / 1000));
  return new HttpError(
    429,
    'rate_limited',
    `${message} Wait ${seconds} second${seconds === 1 ? '' : 's'} and try again.`,
    { retryAfterSeconds: seconds },
    { 'Retry-After': String(seconds) },
  );
}

export interface Limits {
  settings: LimitSettings;
  signInByAccount: GrowingDelay;
  signInByAddress: GrowingDelay;
  signUpByAddress: Quota;
  resetByAddress: Quota;
  resetByAccount: Quota;
  confirmationByAccount: Quota;
  computeByAddress: Quota;
  invitationByTeam: Quota;
  invitationByUser: Quota;
  invitationByAddress: Quota;
  uploadByUser: Quota;
}

/**
 * `namespace` starts every counter's key: instances of one deployment share the default (so they
 * share the counts); tests give each app its own so parallel test files do not count together.
 */
export function createLimits(pool: pg.Pool, settings: LimitSettings, namespace = ''): Limits {
  const ns = (name: string) => `${namespace}${name}`;
  return {
    settings,
    signInByAccount: new GrowingDelay(pool, ns('sign-in-account'), settings.signInFreeFailures, 5 * MINUTE, 24 * HOUR),
    signInByAddress: new GrowingDelay(pool, ns('sign-in-address'), settings.signInFreeFailuresPerAddress, 15 * MINUTE, HOUR),
    signUpByAddress: new Quota(pool, ns('sign-up-address'), settings.signUpsPerAddress, 15 * MINUTE, 'Too many sign-ups from your address.'),
    resetByAddress: new Quota(pool, ns('reset-address'), settings.resetsPerAddress, 15 * MINUTE, 'Too many password reset requests from your address.'),
    resetByAccount: new Quota(pool, ns('reset-account'), settings.resetsPerAccount, HOUR, 'Too many password reset requests for this account.'),
    confirmationByAccount: new Quota(
      pool,
      ns('confirm-account'),
      settings.confirmationsPerAccount,
      HOUR,
      'The confirmation link was sent several times in the last hour.',
    ),
    computeByAddress: new Quota(pool, ns('compute-address'), settings.computePerMinute, MINUTE, 'Too many compute requests.', true),
    invitationByTeam: new Quota(pool, ns('invite-team'), settings.invitationsPerTeam, HOUR, 'This team has sent many invitations in the last hour.'),
    invitationByUser: new Quota(pool, ns('invite-user'), settings.invitationsPerUser, HOUR, 'You have sent many invitations in the last hour.'),
    invitationByAddress: new Quota(
      pool,
      ns('invite-address'),
      settings.invitationsPerAddress,
      HOUR,
      'This address has been sent several invitations in the last hour.',
    ),
    uploadByUser: new Quota(pool, ns('upload-user'), settings.uploadsPerUser, HOUR, 'You have uploaded many files in the last hour.'),
  };
}

/** Counts an upload against the signed-in user's hourly quota before any of the file is read. */
export function countUpload(limits: Limits): RequestHandler {
  return (_req, res, next) => {
    const user = res.locals.user;
    if (!user) return next(new HttpError(401, 'unauthorized', 'Sign in to continue.'));
    limits.uploadByUser.take(user.id).then(() => next(), next);
  };
}

/** Sign-in failures slow down, per account and per address, with growing delays (never a lockout): 429 while either waits. */
export async function assertSignInAllowed(limits: Limits, email: string, address: string) {
  const [account, from] = await Promise.all([limits.signInByAccount.waitMs(email), limits.signInByAddress.waitMs(address)]);
  if (account > 0) throw tooMany('Several wrong sign-ins for this account in a row.', account);
  if (from > 0) throw tooMany('Several wrong sign-ins from your address in a row.', from);
}

export async function signInFailed(limits: Limits, email: string, address: string) {
  await Promise.all([limits.signInByAccount.failed(email), limits.signInByAddress.failed(address)]);
}

export async function signInSucceeded(limits: Limits, email: string, address: string) {
  await Promise.all([limits.signInByAccount.succeeded(email), limits.signInByAddress.succeeded(address)]);
}
