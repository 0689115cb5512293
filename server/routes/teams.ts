import { Router } from 'express';
import { changeRoleSchema, createInvitationSchema, createTeamSchema, renameTeamSchema, teamTwoFactorSchema } from '#shared/schemas/account';
import type { AppDeps } from '../app-deps';
import { requireTeamPermission } from '../auth/access';
import { requireConfirmedEmail, requireUser } from '../auth/session';
import { parseOr400 } from '../http/errors';
import { cancelInvitation, inviteMember, pendingInvitationsOf, resendInvitation } from '../services/invitations';
import { changeMemberRole, leaveTeam, membersOf, removeMember } from '../services/members';
import { createTeam, deleteTeam, renameTeam, setTwoFactorRule, teamDetail, visibleTeams } from '../services/teams';

/** Teams, their members and the invitations owners send. */
export function teamsRouter(deps: AppDeps): Router {
  const { db } = deps;
  const router = Router();

  router.get('/', async (_req, res) => {
    const user = requireUser(res);
    res.json({ teams: await visibleTeams(db, user) });
  });

  router.post('/', async (req, res) => {
    const user = requireUser(res);
    requireConfirmedEmail(user);
    const input = parseOr400(createTeamSchema, req.body);
    res.status(201).json({ team: await createTeam(db, { name: input.name, owner: user, req }) });
  });

  router.get('/:teamId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'team:read');
    res.json(await teamDetail(db, access));
  });

  router.patch('/:teamId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'team:rename');
    const input = parseOr400(renameTeamSchema, req.body);
    res.json({ team: await renameTeam(db, { access, name: input.name, actor: user, req }) });
  });

  /** An owner asks every member to use a second factor (or stops asking). */
  router.put('/:teamId/two-factor', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'team:require-two-factor');
    const input = parseOr400(teamTwoFactorSchema, req.body);
    res.json({ team: await setTwoFactorRule(db, { access, required: input.required, actor: user, req }) });
  });

  router.delete('/:teamId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'team:delete');
    await deleteTeam(db, { access, actor: user, req });
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
    res.json({ member: await changeMemberRole(db, { access, userId: req.params.userId, role: input.role, actor: user, req }) });
  });

  router.delete('/:teamId/members/:userId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'members:remove');
    await removeMember(db, { access, userId: req.params.userId, actor: user, req });
    res.status(204).end();
  });

  router.post('/:teamId/leave', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'team:leave');
    await leaveTeam(db, { access, user, req });
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
    res.status(201).json({ invitation: await inviteMember(deps, { access, inviter: user, email: input.email, role: input.role, req }) });
  });

  router.post('/:teamId/invitations/:invitationId/resend', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'members:invite');
    requireConfirmedEmail(user);
    res.json({ invitation: await resendInvitation(deps, { access, inviter: user, invitationId: req.params.invitationId, req }) });
  });

  router.delete('/:teamId/invitations/:invitationId', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, req.params.teamId, 'members:invite');
    await cancelInvitation(db, { teamId: access.teamId, invitationId: req.params.invitationId, actor: user, req });
    res.status(204).end();
  });

  return router;
}
