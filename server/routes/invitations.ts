import { Router } from 'express';
import type { AppDeps } from '../app-deps';
import { requireUser } from '../auth/session';
import { acceptInvitation, invitationPreview } from '../services/invitations';

/** The invitee's side: read an invitation by the token in its link, and accept it. */
export function invitationsRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    res.json(await invitationPreview(db, req.params.token));
  });

  router.post('/:token/accept', async (req, res) => {
    const user = requireUser(res);
    res.json({ team: await acceptInvitation(db, { token: req.params.token, user, req }) });
  });

  return router;
}
