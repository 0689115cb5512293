import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { users } from '../db/schema';
import { createAccount, createResetToken, findUserByEmail } from './accounts';

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
