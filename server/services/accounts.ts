import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { User } from 'lucia';
import type { Me, TeamSummary, updateProfileSchema } from '#shared/schemas/account';
import type { z } from 'zod';
import type { AppDeps } from '../app-deps';
import { hashPassword } from '../auth/passwords';
import { newId, newToken } from '../auth/tokens';
import type { Db, Tx } from '../db/client';
import { emailConfirmations, teamMembers, teams, users } from '../db/schema';
import { enqueueMail } from '../mail/queue';
import { emailConfirmationMail } from '../mail/templates';

const CONFIRMATION_VALID_HOURS = 48;

function publicUser(user: User | typeof users.$inferSelect): Me['user'] {
  const row = user as Partial<typeof users.$inferSelect> & Partial<User>;
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    isAdmin: user.isAdmin,
    unitSystem: user.unitSystem,
    emailConfirmed: row.emailConfirmed ?? (row.emailConfirmedAt !== null && row.emailConfirmedAt !== undefined),
    twoFactor: row.twoFactor ?? (row.totpEnabledAt !== null && row.totpEnabledAt !== undefined),
  };
}

export async function teamsOf(db: Db, userId: string): Promise<TeamSummary[]> {
  const rows = await db
    .select({ id: teams.id, name: teams.name, personal: teams.personal, role: teamMembers.role, requireTwoFactor: teams.requireTwoFactor })
    .from(teamMembers)
    .innerJoin(teams, eq(teams.id, teamMembers.teamId))
    .where(eq(teamMembers.userId, userId))
    .orderBy(asc(teams.personal), asc(teams.name));
  // The personal team first, then the rest by name.
  return rows.sort((a, b) => Number(b.personal) - Number(a.personal));
}

export async function meOf(db: Db, userId: string): Promise<Me> {
  const [user] = await db.select().from(users).where(eq(users.id, userId));
  return { user: publicUser(user), teams: await teamsOf(db, userId) };
}

/**
 * Creates an account with its personal team, in one transaction. `confirmed` is for accounts
 * whose address needs no link: the demo's, and a site admin made by the operator.
 */
export async function createAccount(db: Db, input: { email: string; password: string; name: string; isAdmin?: boolean; confirmed?: boolean }) {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const userId = newId();
    const teamId = newId();
    await tx.insert(users).values({
      id: userId,
      email: input.email,
      name: input.name,
      passwordHash,
      isAdmin: input.isAdmin ?? false,
      emailConfirmedAt: input.confirmed ? new Date() : null,
    });
    await tx.insert(teams).values({ id: teamId, name: `${input.name}'s team`, personal: true });
    await tx.insert(teamMembers).values({ teamId, userId, role: 'owner' });
    return { userId, teamId };
  });
}

export async function emailOf(db: Db, userId: string): Promise<string> {
  const [row] = await db.select({ email: users.email }).from(users).where(eq(users.id, userId));
  return row.email;
}

/** Changes the user's own name or unit system (nothing when `changes` is empty). */
export async function updateProfile(db: Db, userId: string, changes: z.output<typeof updateProfileSchema>) {
  if (Object.keys(changes).length > 0) await db.update(users).set(changes).where(eq(users.id, userId));
}

export async function findUserByEmail(db: Db, email: string) {
  const [user] = await db.select().from(users).where(eq(users.email, email));
  return user ?? null;
}

/** A new confirmation link; earlier ones stop working. */
async function createConfirmationToken(db: Db, userId: string): Promise<string> {
  const { token, tokenHash } = newToken();
  await db.transaction(async (tx) => {
    await tx
      .update(emailConfirmations)
      .set({ usedAt: new Date() })
      .where(and(eq(emailConfirmations.userId, userId), isNull(emailConfirmations.usedAt)));
    await tx.insert(emailConfirmations).values({ id: newId(), userId, tokenHash, expiresAt: new Date(Date.now() + CONFIRMATION_VALID_HOURS * 3600_000) });
  });
  return token;
}

/**
 * Mails a new confirmation link, at most a few an hour per account (`confirmationsPerAccount`);
 * false when that many went out already.
 */
export async function sendConfirmationLink({ db, config, limits, mail }: Pick<AppDeps, 'db' | 'config' | 'limits' | 'mail'>, userId: string, email: string) {
  if ((await limits.confirmationByAccount.tryTake(userId)) !== true) return false;
  const token = await createConfirmationToken(db, userId);
  await enqueueMail(db, emailConfirmationMail(email, `${config.publicUrl}/confirm-email?token=${token}`, CONFIRMATION_VALID_HOURS));
  mail.kick();
  return true;
}

/** Uses a confirmation link: the user's address is confirmed. Returns the user id, or null for a dead link. */
export async function confirmEmail(db: Db, tokenHash: string): Promise<string | null> {
  return db.transaction(async (tx) => {
    const rows = await tx
      .update(emailConfirmations)
      .set({ usedAt: new Date() })
      .where(and(eq(emailConfirmations.tokenHash, tokenHash), isNull(emailConfirmations.usedAt), gt(emailConfirmations.expiresAt, new Date())))
      .returning({ userId: emailConfirmations.userId });
    const userId = rows[0]?.userId;
    if (!userId) return null;
    await tx
      .update(users)
      .set({ emailConfirmedAt: new Date() })
      .where(and(eq(users.id, userId), isNull(users.emailConfirmedAt)));
    return userId;
  });
}

export async function markEmailConfirmed(db: Db | Tx, userId: string) {
  await db
    .update(users)
    .set({ emailConfirmedAt: new Date() })
    .where(and(eq(users.id, userId), isNull(users.emailConfirmedAt)));
}
