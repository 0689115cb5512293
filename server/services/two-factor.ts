import { and, eq, gt, isNull, lt, sql } from 'drizzle-orm';
import { generateSecret, generateURI, verify } from 'otplib';
import QRCode from 'qrcode';
import { randomInt } from 'node:crypto';
import { hashToken, newId, newToken } from '../auth/tokens';
import type { Db, Tx } from '../db/client';
import { recoveryCodes, signInChallenges, users } from '../db/schema';

/**
 * The optional second factor: TOTP (RFC 6238: HMAC-SHA-1, 6 digits, 30 s steps, as authenticator
 * apps expect) through otplib, and one-time recovery codes. A code is accepted for the current
 * step and one step either side (clock drift), and never for a step at or before the last one
 * accepted (OWASP ASVS 5.0 6.5.x: one use only).
 */
const ISSUER = 'Spoolbook';
const RECOVERY_CODE_COUNT = 10;
/** How long the step between password and code may take, and how many codes may be tried in it. */
const CHALLENGE_MINUTES = 5;
const CHALLENGE_ATTEMPTS = 5;

/** Starts setting up (or again): a new secret, kept aside until a code from it is shown. */
export async function beginTwoFactor(db: Db, user: { id: string; email: string }) {
  const secret = generateSecret();
  await db
    .update(users)
    .set({ totpSecret: secret })
    .where(and(eq(users.id, user.id), isNull(users.totpEnabledAt)));
  const uri = generateURI({ issuer: ISSUER, label: user.email, secret });
  return { secret, uri, qrCode: await QRCode.toDataURL(uri, { margin: 1, width: 200 }) };
}

/** Checks a 6-digit code against the secret and the last accepted step; records the step on success. */
export async function acceptCode(db: Db | Tx, userId: string, code: string, secretOverride?: string): Promise<boolean> {
  const [row] = await db.select({ secret: users.totpSecret, lastStep: users.totpLastStep }).from(users).where(eq(users.id, userId));
  const secret = secretOverride ?? row?.secret;
  if (!secret || !/^\d{6}$/.test(code)) return false;
  const result = await verify({ secret, token: code, epochTolerance: 30, ...(row?.lastStep != null ? { afterTimeStep: row.lastStep } : {}) });
  if (!result.valid) return false;
  // The TOTP strategy's answer carries the step it matched (otplib types it as the HOTP/TOTP union).
  const step = (result as { timeStep?: number }).timeStep ?? Math.floor(Date.now() / 30_000) + (result.delta ?? 0);
  // Conditional on the step still being newer: two requests racing with one code cannot both pass.
  const updated = await db
    .update(users)
    .set({ totpLastStep: step })
    .where(and(eq(users.id, userId), row?.lastStep != null ? eq(users.totpLastStep, row.lastStep) : isNull(users.totpLastStep)))
    .returning({ id: users.id });
  return updated.length === 1;
}

/** New recovery codes (the old ones stop working); returned once, stored hashed. */
export async function newRecoveryCodes(db: Db | Tx, userId: string): Promise<string[]> {
  const alphabet = 'abcdefghjkmnpqrstuvwxyz23456789';
  const codes = Array.from({ length: RECOVERY_CODE_COUNT }, () => {
    const chars = Array.from({ length: 10 }, () => alphabet[randomInt(alphabet.length)]).join('');
    return `${chars.slice(0, 5)}-${chars.slice(5)}`;
  });
  await db.delete(recoveryCodes).where(eq(recoveryCodes.userId, userId));
  await db.insert(recoveryCodes).values(codes.map((c) => ({ id: newId(), userId, codeHash: hashToken(c) })));
  return codes;
}

/** Uses one recovery code, once. */
async function useRecoveryCode(db: Db | Tx, userId: string, code: string): Promise<boolean> {
  const normal = code.trim().toLowerCase();
  if (!/^[a-z0-9]{5}-[a-z0-9]{5}$/.test(normal)) return false;
  const rows = await db
    .update(recoveryCodes)
    .set({ usedAt: new Date() })
    .where(and(eq(recoveryCodes.userId, userId), eq(recoveryCodes.codeHash, hashToken(normal)), isNull(recoveryCodes.usedAt)))
    .returning({ id: recoveryCodes.id });
  return rows.length === 1;
}

export async function recoveryCodesLeft(db: Db, userId: string): Promise<number> {
  const rows = await db
    .select({ id: recoveryCodes.id })
    .from(recoveryCodes)
    .where(and(eq(recoveryCodes.userId, userId), isNull(recoveryCodes.usedAt)));
  return rows.length;
}

/** A code from an authenticator app or a recovery code, whichever it looks like. */
export async function acceptSecondFactor(db: Db | Tx, userId: string, code: string): Promise<'code' | 'recovery' | null> {
  const compact = code.replace(/\s+/g, '');
  if (/^\d{6}$/.test(compact)) return (await acceptCode(db, userId, compact)) ? 'code' : null;
  return (await useRecoveryCode(db, userId, code)) ? 'recovery' : null;
}

export async function createChallenge(db: Db, userId: string): Promise<string> {
  const { token, tokenHash } = newToken();
  await db.insert(signInChallenges).values({ id: newId(), userId, tokenHash, expiresAt: new Date(Date.now() + CHALLENGE_MINUTES * 60_000) });
  return token;
}

/**
 * The user of a live challenge, counting one attempt; null when it expired, was used up or never
 * existed. A challenge allows CHALLENGE_ATTEMPTS codes, then the password must be given again.
 */
export async function challengeUser(db: Db, token: string): Promise<string | null> {
  const rows = await db
    .update(signInChallenges)
    .set({ attempts: sql`${signInChallenges.attempts} + 1` })
    .where(and(eq(signInChallenges.tokenHash, hashToken(token)), gt(signInChallenges.expiresAt, new Date()), lt(signInChallenges.attempts, CHALLENGE_ATTEMPTS)))
    .returning({ userId: signInChallenges.userId });
  return rows[0]?.userId ?? null;
}

export async function endChallenge(db: Db, token: string) {
  await db.delete(signInChallenges).where(eq(signInChallenges.tokenHash, hashToken(token)));
}

export async function turnOffTwoFactor(db: Db | Tx, userId: string) {
  await db.update(users).set({ totpSecret: null, totpEnabledAt: null, totpLastStep: null }).where(eq(users.id, userId));
  await db.delete(recoveryCodes).where(eq(recoveryCodes.userId, userId));
}

/** Whether the set-up was started: a secret waits for its first code. */
export async function setupStarted(db: Db, userId: string): Promise<boolean> {
  const [row] = await db.select({ secret: users.totpSecret }).from(users).where(eq(users.id, userId));
  return Boolean(row?.secret);
}

/** Turns the second factor on and makes the first recovery codes, in one transaction. */
export async function enableTwoFactor(db: Db, userId: string): Promise<string[]> {
  return db.transaction(async (tx) => {
    await tx.update(users).set({ totpEnabledAt: new Date() }).where(eq(users.id, userId));
    return newRecoveryCodes(tx, userId);
  });
}
