import { and, eq, gt, isNull } from 'drizzle-orm';
import { Router } from 'express';
import { requireUser } from '../auth/session';
import { hashToken } from '../auth/tokens';
import { invitations, teamMembers, teams, users } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import type { AppDeps } from '../app-deps';
import { markEmailConfirmed } from '../services/accounts';
import { audit } from '../services/audit';

/** The invitee's side: read an invitation by the token in its link, and accept it. */
export function invitationsRouter({ db }: AppDeps): Router {
  const router = Router();

  async function pending(token: string) {
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
        and(
          eq(invitations.tokenHash, hashToken(token)),
          isNull(invitations.acceptedAt),
          isNull(invitations.cancelledAt),
          gt(invitations.expiresAt, new Date()),
        ),
      );
    if (!row) throw notFound('This invitation is not valid any more: it was used, cancelled or replaced, or it expired. Ask for a new one.');
    return row;
  }

  router.get('/:token', async (req, res) => {
    const inv = await pending(req.params.token);
    res.json({ teamName: inv.teamName, role: inv.role, email: inv.email, invitedBy: inv.invitedBy, expiresAt: inv.expiresAt.toISOString() });
  });

  router.post('/:token/accept', async (req, res) => {
    const user = requireUser(res);
    const inv = await pending(req.params.token);
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
    res.json({ team: { id: inv.teamId, name: inv.teamName, personal: inv.personal, role: member.role } });
  });

  return router;
}
