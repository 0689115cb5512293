import { and, eq, gt, isNull } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import { judgePassword } from '#shared/passwords/strength';
import type { AppDeps } from '../app-deps';
import { burnVerifyTime, hashPassword, verifyPassword } from '../auth/passwords';
import { newId, newToken } from '../auth/tokens';
import type { Db, Tx } from '../db/client';
import { passwordResets, users } from '../db/schema';
import { HttpError } from '../http/errors';
import { enqueueMail } from '../mail/queue';
import { passwordResetMail } from '../mail/templates';
import { findUserByEmail } from './accounts';
import { audit } from './audit';
import { assertSignInAllowed, signInFailed } from './limits';

/**
 * Passwords: the strength rule, the current password asked again before a change that matters,
 * changing one, and reset links (only the SHA-256 of a link's token is stored; only the newest
 * link of a user works, and a reset or a change ends every link).
 */

const RESET_VALID_MINUTES = 60;

/** 400 naming the password field when the password is weak (OWASP ASVS 5.0 6.2.4, 6.2.11). */
export function assertStrongPassword(password: string, field: string, context: { email: string; name: string }) {
  const { problem } = judgePassword(password, context);
  if (problem) throw new HttpError(400, 'weak_password', `The password ${problem}.`, { issues: [{ path: field, message: problem }] });
}

/**
 * The current password, again, before a change that matters (OWASP ASVS 5.0 6.4.x
 * re-authentication); wrong ones count as failed sign-ins and slow down alike.
 */
export async function assertCurrentPassword({ db, limits }: Pick<AppDeps, 'db' | 'limits'>, user: User, password: string, field: string, address: string) {
  await assertSignInAllowed(limits, user.email, address);
  const [row] = await db.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, user.id));
  if (!(await verifyPassword(row.passwordHash, password))) {
    await signInFailed(limits, user.email, address);
    throw new HttpError(400, 'invalid_input', 'The current password is not right.', { issues: [{ path: field, message: 'is not right' }] });
  }
}

/**
 * The account an e-mail and password sign in to, if they do. An unknown address costs the same
 * time as a wrong password, so the answer's timing does not tell which it was.
 */
export async function checkPassword(db: Db, email: string, password: string) {
  const user = await findUserByEmail(db, email);
  const ok = user ? await verifyPassword(user.passwordHash, password) : (await burnVerifyTime(password), false);
  return { user, ok };
}

/** Sets a new password and ends every reset link of the user, in one transaction. */
export async function changePassword(db: Db, userId: string, newPassword: string) {
  await db.transaction(async (tx) => {
    await tx
      .update(users)
      .set({ passwordHash: await hashPassword(newPassword), passwordChangedAt: new Date() })
      .where(eq(users.id, userId));
    await endResetLinks(tx, userId);
  });
}

/** The user of a reset link that is live (unused, unexpired), without using it. */
export async function liveResetUser(db: Db, tokenHash: string) {
  const [row] = await db
    .select({ userId: users.id, email: users.email, name: users.name })
    .from(passwordResets)
    .innerJoin(users, eq(users.id, passwordResets.userId))
    .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())));
  return row ?? null;
}

/** Marks a reset token used and returns its user, only if it is unused and unexpired (atomic). */
async function consumeResetToken(db: Db | Tx, tokenHash: string): Promise<string | null> {
  const rows = await db
    .update(passwordResets)
    .set({ usedAt: new Date() })
    .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
    .returning({ userId: passwordResets.userId });
  return rows[0]?.userId ?? null;
}

/** Ends every reset link of a user that was not used yet (a new one, a reset, a password change). */
async function endResetLinks(db: Db | Tx, userId: string) {
  await db
    .update(passwordResets)
    .set({ usedAt: new Date() })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}

/** A new reset link for the user; the earlier one stops working (one live link per user). */
export async function createResetToken(db: Db, userId: string, validMinutes = RESET_VALID_MINUTES): Promise<string> {
  const { token, tokenHash } = newToken();
  await db.transaction(async (tx) => {
    await endResetLinks(tx, userId);
    await tx.insert(passwordResets).values({ id: newId(), userId, tokenHash, expiresAt: new Date(Date.now() + validMinutes * 60_000) });
  });
  return token;
}

/**
 * Uses a reset link: the new password is set and every link of the user ends, in one
 * transaction. Returns the user, or null when the link was used or expired meanwhile.
 */
export async function resetPassword(db: Db, tokenHash: string, password: string): Promise<string | null> {
  const passwordHash = await hashPassword(password);
  return db.transaction(async (tx) => {
    const used = await consumeResetToken(tx, tokenHash);
    if (!used) return null;
    await tx.update(users).set({ passwordHash, passwordChangedAt: new Date() }).where(eq(users.id, used));
    await endResetLinks(tx, used);
    return used;
  });
}

/**
 * The work of a reset request, done after it was answered: look the address up and, for an
 * account within its hourly quota, mail a new link. Recorded either way, without saying more.
 */
export async function mailResetLink({ db, config, limits, mail }: Pick<AppDeps, 'db' | 'config' | 'limits' | 'mail'>, email: string, req: Request) {
  const user = await findUserByEmail(db, email);
  const withinQuota = user ? (await limits.resetByAccount.tryTake(user.id)) === true : false;
  await audit(db, { action: 'auth.password-reset-requested', actorEmail: email, details: { knownAddress: Boolean(user), sent: withinQuota }, req });
  if (!user || !withinQuota) return;
  const token = await createResetToken(db, user.id);
  await enqueueMail(db, passwordResetMail(user.email, `${config.publicUrl}/reset-password?token=${token}`, RESET_VALID_MINUTES));
  mail.kick();
}
