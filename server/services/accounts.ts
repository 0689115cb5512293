import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { User } from 'lucia';
import type { Me, TeamSummary } from '../../shared/schemas/account';
import { hashPassword } from '../auth/passwords';
import { newId } from '../auth/tokens';
import type { Db } from '../db/client';
import { passwordResets, teamMembers, teams, users } from '../db/schema';

export const RESET_VALID_MINUTES = 60;

export function publicUser(user: User | typeof users.$inferSelect): Me['user'] {
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin, unitSystem: user.unitSystem };
}

export async function teamsOf(db: Db, userId: string): Promise<TeamSummary[]> {
  const rows = await db
    .select({ id: teams.id, name: teams.name, personal: teams.personal, role: teamMembers.role })
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

/** Creates an account with its personal team, in one transaction. */
export async function createAccount(db: Db, input: { email: string; password: string; name: string; isAdmin?: boolean }) {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const userId = newId();
    const teamId = newId();
    await tx.insert(users).values({ id: userId, email: input.email, name: input.name, passwordHash, isAdmin: input.isAdmin ?? false });
    await tx.insert(teams).values({ id: teamId, name: `${input.name}'s team`, personal: true });
    await tx.insert(teamMembers).values({ teamId, userId, role: 'owner' });
    return { userId, teamId };
  });
}

export async function findUserByEmail(db: Db, email: string) {
  const [user] = await db.select().from(users).where(eq(users.email, email));
  return user ?? null;
}

/** Marks a reset token used and returns its user, only if it is unused and unexpired (atomic). */
export async function consumeResetToken(db: Db, tokenHash: string): Promise<string | null> {
  const rows = await db
    .update(passwordResets)
    .set({ usedAt: new Date() })
    .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
    .returning({ userId: passwordResets.userId });
  return rows[0]?.userId ?? null;
}

export async function createResetToken(db: Db, userId: string, tokenHash: string) {
  await db.insert(passwordResets).values({
    id: newId(),
    userId,
    tokenHash,
    expiresAt: new Date(Date.now() + RESET_VALID_MINUTES * 60_000),
  });
}
