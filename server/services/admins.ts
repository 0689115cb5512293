import { randomBytes } from 'node:crypto';
import { and, count, eq, gt, ilike, max, or } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import type { Db } from '../db/client';
import { sessions, users } from '../db/schema';
import { notFound } from '../http/errors';
import { createAccount, findUserByEmail } from './accounts';
import { createResetToken } from './passwords';
import { audit } from './audit';
import { endAllSessions } from './sessions';
import { likePattern } from './text-search';

/** Site administration: the first site admin, and the Users page. */

/** How long the first admin's set-password link works. */
export const FIRST_ADMIN_LINK_MINUTES = 24 * 60;

export async function hasSiteAdmin(db: Db): Promise<boolean> {
  const [row] = await db.select({ id: users.id }).from(users).where(eq(users.isAdmin, true)).limit(1);
  return Boolean(row);
}

/**
 * Makes `email` a site admin, never with a known password: a new account gets a random password
 * nobody learns and a one-time link to choose one; an existing account keeps its own password.
 * `token` is that link's token (null for an existing account).
 */
export async function makeSiteAdmin(db: Db, email: string, name: string): Promise<{ userId: string; created: boolean; token: string | null }> {
  const existing = await findUserByEmail(db, email);
  if (existing) {
    await db
      .update(users)
      .set({ isAdmin: true, emailConfirmedAt: existing.emailConfirmedAt ?? new Date() })
      .where(eq(users.id, existing.id));
    return { userId: existing.id, created: false, token: null };
  }
  const { userId } = await createAccount(db, { email, name, password: randomBytes(32).toString('base64url'), isAdmin: true, confirmed: true });
  return { userId, created: true, token: await createResetToken(db, userId, FIRST_ADMIN_LINK_MINUTES) };
}

/**
 * The Users page: accounts whose e-mail or name holds `q` (every account when it is empty), at
 * most 100 by e-mail, each with its live sessions and when one was last used.
 */
export async function searchUsers(db: Db, q: string) {
  // Only sessions that still work count, as on the user's own Sessions page.
  const live = and(eq(sessions.userId, users.id), gt(sessions.expiresAt, new Date()));
  const pattern = likePattern(q);
  const rows = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      isAdmin: users.isAdmin,
      totpEnabledAt: users.totpEnabledAt,
      emailConfirmedAt: users.emailConfirmedAt,
      sessions: count(sessions.id),
      lastSeenAt: max(sessions.lastSeenAt),
    })
    .from(users)
    .leftJoin(sessions, live)
    .where(q ? or(ilike(users.email, pattern), ilike(users.name, pattern)) : undefined)
    .groupBy(users.id)
    .orderBy(users.email)
    .limit(100);
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    name: r.name,
    isAdmin: r.isAdmin,
    twoFactor: r.totpEnabledAt !== null,
    emailConfirmed: r.emailConfirmedAt !== null,
    sessions: r.sessions,
    lastSeenAt: r.lastSeenAt ? new Date(r.lastSeenAt).toISOString() : null,
  }));
}

/** A site admin ends every session of a user; returns how many ended. */
export async function endSessionsOfUser(db: Db, input: { userId: string; admin: User; req: Request }): Promise<number> {
  const { admin, req } = input;
  const [target] = await db.select({ id: users.id, email: users.email }).from(users).where(eq(users.id, input.userId));
  if (!target) throw notFound('No such user.');
  const ended = await endAllSessions(db, target.id);
  await audit(db, { action: 'admin.sessions-ended', actor: admin, targetType: 'user', targetId: target.id, details: { ended, email: target.email }, req });
  return ended;
}
