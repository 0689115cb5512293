import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import type { Invitation, Role } from '#shared/schemas/account';
import type { AppDeps } from '../app-deps';
import type { TeamAccess } from '../auth/access';
import { hashToken, newId, newToken } from '../auth/tokens';
import type { Db } from '../db/client';
import { invitations, teamMembers, teams, users } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { enqueueMail } from '../mail/queue';
import { invitationMail } from '../mail/templates';
import { markEmailConfirmed } from './accounts';
import { audit } from './audit';

/**
 * Invitations by e-mail: owners invite, resend and cancel; the invitee reads one by the token in
 * its link and accepts it. Only the SHA-256 of a token is stored; only the newest link of an
 * invitation works.
 */

const INVITATION_VALID_DAYS = 7;
const DAY_MS = 86_400_000;

/** What sending an invitation needs: the database, the limits, the mail worker, the public address for links. */
type MailingDeps = Pick<AppDeps, 'db' | 'config' | 'limits' | 'mail'>;

export async function pendingInvitationsOf(db: Db, teamId: string): Promise<Invitation[]> {
  const rows = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      invitedBy: users.name,
      createdAt: invitations.createdAt,
      expiresAt: invitations.expiresAt,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(and(eq(invitations.teamId, teamId), isNull(invitations.acceptedAt), isNull(invitations.cancelledAt), gt(invitations.expiresAt, new Date())))
    .orderBy(asc(invitations.createdAt));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), expiresAt: r.expiresAt.toISOString() }));
}

/** Invitations and resends count per team, per inviter and per invited address, each per hour. */
async function takeInvitationQuota({ limits }: MailingDeps, teamId: string, userId: string, email: string) {
  await limits.invitationByTeam.take(teamId);
  await limits.invitationByUser.take(userId);
  await limits.invitationByAddress.take(email);
}

async function sendInvitation({ db, config, mail }: MailingDeps, email: string, token: string, teamName: string, inviterName: string, role: string) {
  const link = `${config.publicUrl}/invitations/${token}`;
  await enqueueMail(db, invitationMail(email, link, teamName, inviterName, role, INVITATION_VALID_DAYS));
  mail.kick();
}

/** Invites an address into the team and mails the link; a new invitation replaces a pending one for that address. */
export async function inviteMember(deps: MailingDeps, input: { access: TeamAccess; inviter: User; email: string; role: Role; req: Request }) {
  const { db } = deps;
  const { access, inviter, email, role, req } = input;
  await takeInvitationQuota(deps, access.teamId, inviter.id, email);
  const [already] = await db
    .select({ userId: users.id })
    .from(teamMembers)
    .innerJoin(users, eq(users.id, teamMembers.userId))
    .where(and(eq(teamMembers.teamId, access.teamId), eq(users.email, email)));
  if (already) {
    throw new HttpError(409, 'already_member', `${email} is already a member of this team.`, {
      issues: [{ path: 'email', message: 'is already a member' }],
    });
  }
  // A new invitation replaces any earlier pending one for the same address.
  await db
    .update(invitations)
    .set({ cancelledAt: new Date() })
    .where(and(eq(invitations.teamId, access.teamId), eq(invitations.email, email), isNull(invitations.acceptedAt), isNull(invitations.cancelledAt)));
  const { token, tokenHash } = newToken();
  const id = newId();
  await db.insert(invitations).values({
    id,
    teamId: access.teamId,
    email,
    role,
    tokenHash,
    invitedBy: inviter.id,
    expiresAt: new Date(Date.now() + INVITATION_VALID_DAYS * DAY_MS),
  });
  await audit(db, {
    action: 'invitation.created',
    teamId: access.teamId,
    actor: inviter,
    targetType: 'invitation',
    targetId: id,
    details: { email, role },
    req,
  });
  await sendInvitation(deps, email, token, access.teamName, inviter.name, role);
  return (await pendingInvitationsOf(db, access.teamId)).find((i) => i.id === id);
}

/** A pending invitation of the team, by id. */
const pendingOfTeam = (teamId: string, invitationId: string) =>
  and(eq(invitations.id, invitationId), eq(invitations.teamId, teamId), isNull(invitations.acceptedAt), isNull(invitations.cancelledAt));

/** Mails a pending invitation again with a new link; the earlier link stops working. */
export async function resendInvitation(deps: MailingDeps, input: { access: TeamAccess; inviter: User; invitationId: string; req: Request }) {
  const { db } = deps;
  const { access, inviter, invitationId, req } = input;
  const [pendingOne] = await db.select({ email: invitations.email }).from(invitations).where(pendingOfTeam(access.teamId, invitationId));
  if (!pendingOne) throw notFound('No such pending invitation.');
  await takeInvitationQuota(deps, access.teamId, inviter.id, pendingOne.email);
  const { token, tokenHash } = newToken();
  const rows = await db
    .update(invitations)
    .set({ tokenHash, expiresAt: new Date(Date.now() + INVITATION_VALID_DAYS * DAY_MS) })
    .where(pendingOfTeam(access.teamId, invitationId))
    .returning();
  const row = rows[0];
  if (!row) throw notFound('No such pending invitation.');
  await audit(db, {
    action: 'invitation.resent',
    teamId: access.teamId,
    actor: inviter,
    targetType: 'invitation',
    targetId: row.id,
    details: { email: row.email, role: row.role },
    req,
  });
  await sendInvitation(deps, row.email, token, access.teamName, inviter.name, row.role);
  return (await pendingInvitationsOf(db, access.teamId)).find((i) => i.id === row.id);
}

export async function cancelInvitation(db: Db, input: { teamId: string; invitationId: string; actor: User; req: Request }) {
  const { teamId, invitationId, actor, req } = input;
  const rows = await db.update(invitations).set({ cancelledAt: new Date() }).where(pendingOfTeam(teamId, invitationId)).returning({ id: invitations.id });
  if (rows.length === 0) throw notFound('No such pending invitation.');
  await audit(db, { action: 'invitation.cancelled', teamId, actor, targetType: 'invitation', targetId: invitationId, req });
}

/** The live invitation a link's token names; 404 when it was used, cancelled, replaced or expired. */
async function pendingInvitation(db: Db, token: string) {
  if (token.length < 10 || token.length > 200) throw notFound('This invitation is not valid.');
  const [row] = await db
    .select({
      id: invitations.id,
      teamId: invitations.teamId,
      teamName: teams.name,
      personal: teams.personal,
      email: invitations.email,
      role: invitations.role,
      invitedBy: users.name,
      expiresAt: invitations.expiresAt,
    })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(
      and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), isNull(invitations.cancelledAt), gt(invitations.expiresAt, new Date())),
    );
  if (!row) throw notFound('This invitation is not valid any more: it was used, cancelled or replaced, or it expired. Ask for a new one.');
  return row;
}

/** What the invitee sees before accepting. */
export async function invitationPreview(db: Db, token: string) {
  const inv = await pendingInvitation(db, token);
  return { teamName: inv.teamName, role: inv.role, email: inv.email, invitedBy: inv.invitedBy, expiresAt: inv.expiresAt.toISOString() };
}

/** Joins the team with the invitation's role; only the account with the invited address may. */
export async function acceptInvitation(db: Db, input: { token: string; user: User; req: Request }) {
  const { user, req } = input;
  const inv = await pendingInvitation(db, input.token);
  if (inv.email !== user.email) {
    throw new HttpError(
      403,
      'wrong_account',
      `This invitation is for ${inv.email}, but you are signed in as ${user.email}. Sign out and sign in with the invited address.`,
    );
  }
  await db.transaction(async (tx) => {
    // The invitation's link was mailed to this very address, and the account has that address:
    // opening it proves the address as a confirmation link does.
    if (!user.emailConfirmed) await markEmailConfirmed(tx, user.id);
    const used = await tx
      .update(invitations)
      .set({ acceptedAt: new Date() })
      .where(and(eq(invitations.id, inv.id), isNull(invitations.acceptedAt), isNull(invitations.cancelledAt)))
      .returning({ id: invitations.id });
    if (used.length === 0) throw notFound('This invitation was used already.');
    await tx.insert(teamMembers).values({ teamId: inv.teamId, userId: user.id, role: inv.role }).onConflictDoNothing();
    await audit(tx, {
      action: 'invitation.accepted',
      teamId: inv.teamId,
      actor: user,
      targetType: 'invitation',
      targetId: inv.id,
      details: { role: inv.role },
      req,
    });
  });
  const [member] = await db
    .select({ role: teamMembers.role })
    .from(teamMembers)
    .where(and(eq(teamMembers.teamId, inv.teamId), eq(teamMembers.userId, user.id)));
  return { id: inv.teamId, name: inv.teamName, personal: inv.personal, role: member.role };
}
