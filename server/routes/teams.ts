import { and, eq, isNull } from 'drizzle-orm';
import { Router } from 'express';
import { changeRoleSchema, createInvitationSchema, createTeamSchema, renameTeamSchema, teamTwoFactorSchema } from '#shared/schemas/account';
import { requireTeamPermission } from '../auth/access';
import { requireConfirmedEmail, requireUser } from '../auth/session';
import { newId, newToken } from '../auth/tokens';
import { invitations, teamMembers, teams, users } from '../db/schema';
import { HttpError, notFound, parseOr400 } from '../http/errors';
import { enqueueMail } from '../mail/queue';
import { invitationMail } from '../mail/templates';
import { teamsOf } from '../services/accounts';
import { assertOwnerRemains, INVITATION_VALID_DAYS, membersOf, pendingInvitationsOf, revokeShareLinksOfLeaver } from '../services/teams';
import type { AppDeps } from '../app-deps';
import { audit } from '../services/audit';

export function teamsRouter({ db, config, limits, mail }: AppDeps): Router {
  const router = Router();

  /** Invitations and resends count per team, per inviter and per invited address, each per hour. */
  async function takeInvitationQuota(teamId: string, userId: string, email: string) {
    await limits.invitationByTeam.take(teamId);
    await limits.invitationByUser.take(userId);
    await limits.invitationByAddress.take(email);
  }

  async function sendInvitation(email: string, token: string, teamName: string, inviterName: string, role: string) {
    const link = `${config.publicUrl}/invitations/${token}`;
    await enqueueMail(db, invitationMail(email, link, teamName, inviterName, role, INVITATION_VALID_DAYS));
    mail.kick();
  }

  router.get('/', async (_req, res) => {
    const user = requireUser(res);
    const mine = await teamsOf(db, user.id);
    if (!user.isAdmin) return void res.json({ teams: mine });
    const all = await db
      .select({ id: teams.id, name: teams.name, personal: teams.personal, requireTwoFactor: teams.requireTwoFactor })
      .from(teams)
      .orderBy(teams.name);
    const roles = new Map(mine.map((t) => [t.id, t.role]));
    res.json({ teams: all.map((t) => ({ ...t, role: roles.get(t.id) ?? null })) });
  });

  router.post('/', async (req, res) => {
    const user = requireUser(res);
    requireConfirmedEmail(user);
    const input = parseOr400(createTeamSchema, req.body);
    const id = newId();
    await db.transaction(async (tx) => {
      await tx.insert(teams).values({ id, name: input.name, personal: false });
      await tx.insert(teamMembers).values({ teamId: id, userId: user.id, role: 'owner' });
      await audit(tx, { action: 'team.created', teamId: id, actor: user, targetType: 'team', targetId: id, details: { name: input.name }, req });
    });
    res.status(201).json({ team: { id, name: input.name, personal: false, role: 'owner', requireTwoFactor: false } });
  });

  router.get('/:teamId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'team:read');
    const isOwner = access.role === 'owner';
    res.json({
      team: { id: access.teamId, name: access.teamName, personal: access.personal, role: access.role, requireTwoFactor: access.requireTwoFactor },
      members: await membersOf(db, access.teamId),
      invitations: isOwner ? await pendingInvitationsOf(db, access.teamId) : [],
    });
  });

  router.patch('/:teamId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'team:rename');
    const input = parseOr400(renameTeamSchema, req.body);
    await db.update(teams).set({ name: input.name }).where(eq(teams.id, access.teamId));
    await audit(db, {
      action: 'team.renamed',
      teamId: access.teamId,
      actor: user,
      targetType: 'team',
      targetId: access.teamId,
      details: { from: access.teamName, to: input.name },
      req,
    });
    res.json({ team: { id: access.teamId, name: input.name, personal: access.personal, role: access.role, requireTwoFactor: access.requireTwoFactor } });
  });

  /** An owner asks every member to use a second factor (or stops asking). */
  router.put('/:teamId/two-factor', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'team:rename');
    const input = parseOr400(teamTwoFactorSchema, req.body);
    if (input.required && !user.twoFactor) {
      throw new HttpError(
        400,
        'two_factor_needed',
        'Turn on your own second factor first (Account → Second factor), or you would lock yourself out of this team.',
      );
    }
    await db.update(teams).set({ requireTwoFactor: input.required }).where(eq(teams.id, access.teamId));
    await audit(db, {
      action: 'team.two-factor-rule',
      teamId: access.teamId,
      actor: user,
      targetType: 'team',
      targetId: access.teamId,
      details: { required: input.required },
      req,
    });
    res.json({ team: { id: access.teamId, name: access.teamName, personal: access.personal, role: access.role, requireTwoFactor: input.required } });
  });

  router.delete('/:teamId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'team:delete');
    if (access.personal) throw new HttpError(400, 'personal_team', 'A personal team cannot be deleted.');
    await db.transaction(async (tx) => {
      await tx.delete(teams).where(eq(teams.id, access.teamId));
      await audit(tx, {
        action: 'team.deleted',
        teamId: access.teamId,
        actor: user,
        targetType: 'team',
        targetId: access.teamId,
        details: { name: access.teamName },
        req,
      });
    });
    res.status(204).end();
  });

  router.get('/:teamId/members', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'members:list');
    res.json({ members: await membersOf(db, access.teamId) });
  });

  router.patch('/:teamId/members/:userId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'members:change-role');
    const input = parseOr400(changeRoleSchema, req.body);
    await db.transaction(async (tx) => {
      await assertOwnerRemains(tx, access.teamId, req.params.userId, input.role, access.role === 'owner' ? user.id : null);
      await tx
        .update(teamMembers)
        .set({ role: input.role })
        .where(and(eq(teamMembers.teamId, access.teamId), eq(teamMembers.userId, req.params.userId)));
      await audit(tx, {
        action: 'member.role-changed',
        teamId: access.teamId,
        actor: user,
        targetType: 'user',
        targetId: req.params.userId,
        details: { role: input.role },
        req,
      });
    });
    const member = (await membersOf(db, access.teamId)).find((m) => m.userId === req.params.userId);
    res.json({ member });
  });

  router.delete('/:teamId/members/:userId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'members:remove');
    await db.transaction(async (tx) => {
      await assertOwnerRemains(tx, access.teamId, req.params.userId, null, access.role === 'owner' ? user.id : null);
      await tx.delete(teamMembers).where(and(eq(teamMembers.teamId, access.teamId), eq(teamMembers.userId, req.params.userId)));
      const shareLinksRevoked = await revokeShareLinksOfLeaver(tx, access.teamId, req.params.userId);
      await audit(tx, {
        action: 'member.removed',
        teamId: access.teamId,
        actor: user,
        targetType: 'user',
        targetId: req.params.userId,
        details: { shareLinksRevoked },
        req,
      });
    });
    res.status(204).end();
  });

  router.post('/:teamId/leave', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'team:leave');
    if (access.personal) throw new HttpError(400, 'personal_team', 'You cannot leave your personal team.');
    await db.transaction(async (tx) => {
      await assertOwnerRemains(tx, access.teamId, user.id, null);
      await tx.delete(teamMembers).where(and(eq(teamMembers.teamId, access.teamId), eq(teamMembers.userId, user.id)));
      const shareLinksRevoked = await revokeShareLinksOfLeaver(tx, access.teamId, user.id);
      await audit(tx, {
        action: 'member.left',
        teamId: access.teamId,
        actor: user,
        targetType: 'user',
        targetId: user.id,
        details: { shareLinksRevoked },
        req,
      });
    });
    res.status(204).end();
  });

  router.get('/:teamId/invitations', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'members:invite');
    res.json({ invitations: await pendingInvitationsOf(db, access.teamId) });
  });

  router.post('/:teamId/invitations', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'members:invite');
    requireConfirmedEmail(user);
    const input = parseOr400(createInvitationSchema, req.body);
    await takeInvitationQuota(access.teamId, user.id, input.email);
    const [already] = await db
      .select({ userId: users.id })
      .from(teamMembers)
      .innerJoin(users, eq(users.id, teamMembers.userId))
      .where(and(eq(teamMembers.teamId, access.teamId), eq(users.email, input.email)));
    if (already) {
      throw new HttpError(409, 'already_member', `${input.email} is already a member of this team.`, {
        issues: [{ path: 'email', message: 'is already a member' }],
      });
    }
    // A new invitation replaces any earlier pending one for the same address.
    await db
      .update(invitations)
      .set({ cancelledAt: new Date() })
      .where(and(eq(invitations.teamId, access.teamId), eq(invitations.email, input.email), isNull(invitations.acceptedAt), isNull(invitations.cancelledAt)));
    const { token, tokenHash } = newToken();
    const id = newId();
    await db.insert(invitations).values({
      id,
      teamId: access.teamId,
      email: input.email,
      role: input.role,
      tokenHash,
      invitedBy: user.id,
      expiresAt: new Date(Date.now() + INVITATION_VALID_DAYS * 86_400_000),
    });
    await audit(db, {
      action: 'invitation.created',
      teamId: access.teamId,
      actor: user,
      targetType: 'invitation',
      targetId: id,
      details: { email: input.email, role: input.role },
      req,
    });
    await sendInvitation(input.email, token, access.teamName, user.name, input.role);
    const invitation = (await pendingInvitationsOf(db, access.teamId)).find((i) => i.id === id);
    res.status(201).json({ invitation });
  });

  router.post('/:teamId/invitations/:invitationId/resend', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'members:invite');
    requireConfirmedEmail(user);
    const [pendingOne] = await db
      .select({ email: invitations.email })
      .from(invitations)
      .where(
        and(
          eq(invitations.id, req.params.invitationId),
          eq(invitations.teamId, access.teamId),
          isNull(invitations.acceptedAt),
          isNull(invitations.cancelledAt),
        ),
      );
    if (!pendingOne) throw notFound('No such pending invitation.');
    await takeInvitationQuota(access.teamId, user.id, pendingOne.email);
    const { token, tokenHash } = newToken();
    const rows = await db
      .update(invitations)
      .set({ tokenHash, expiresAt: new Date(Date.now() + INVITATION_VALID_DAYS * 86_400_000) })
      .where(
        and(
          eq(invitations.id, req.params.invitationId),
          eq(invitations.teamId, access.teamId),
          isNull(invitations.acceptedAt),
          isNull(invitations.cancelledAt),
        ),
      )
      .returning();
    const row = rows[0];
    if (!row) throw notFound('No such pending invitation.');
    await audit(db, {
      action: 'invitation.resent',
      teamId: access.teamId,
      actor: user,
      targetType: 'invitation',
      targetId: row.id,
      details: { email: row.email, role: row.role },
      req,
    });
    await sendInvitation(row.email, token, access.teamName, user.name, row.role);
    const invitation = (await pendingInvitationsOf(db, access.teamId)).find((i) => i.id === row.id);
    res.json({ invitation });
  });

  router.delete('/:teamId/invitations/:invitationId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'members:invite');
    const rows = await db
      .update(invitations)
      .set({ cancelledAt: new Date() })
      .where(
        and(
          eq(invitations.id, req.params.invitationId),
          eq(invitations.teamId, access.teamId),
          isNull(invitations.acceptedAt),
          isNull(invitations.cancelledAt),
        ),
      )
      .returning({ id: invitations.id });
    if (rows.length === 0) throw notFound('No such pending invitation.');
    await audit(db, { action: 'invitation.cancelled', teamId: access.teamId, actor: user, targetType: 'invitation', targetId: req.params.invitationId, req });
    res.status(204).end();
  });

  return router;
}
