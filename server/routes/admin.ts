import { Router } from 'express';
import { userSearchQuerySchema } from '#shared/schemas/account';
import type { AppDeps } from '../app-deps';
import { requireAdmin } from '../auth/session';
import { parseOr400 } from '../http/errors';
import { endSessionsOfUser, searchUsers } from '../services/admins';
import { outboxMessage, outboxMessages } from '../services/outbox';

/** Site-admin pages: the mail outbox of the local fake SMTP server, and users' sessions. Others get 404. */
export function adminRouter({ db, config }: AppDeps): Router {
  const router = Router();
  router.use((_req, res, next) => {
    requireAdmin(res);
    next();
  });
  // Tokens show only where nobody else's mail can be: development with the local mail catcher.
  const showTokens = config.development && !config.smtpUrl;

  router.get('/outbox', async (_req, res) => {
    res.json({ messages: await outboxMessages(db, showTokens), tokensHidden: !showTokens });
  });

  router.get('/outbox/:id', async (req, res) => {
    res.json({ message: await outboxMessage(db, req.params.id, showTokens), tokensHidden: !showTokens });
  });

  router.get('/users', async (req, res) => {
    const { q } = parseOr400(userSearchQuerySchema, { ...req.query }, 'query');
    res.json({ users: await searchUsers(db, q) });
  });

  router.post('/users/:userId/end-sessions', async (req, res) => {
    const admin = requireAdmin(res);
    res.json({ ended: await endSessionsOfUser(db, { userId: req.params.userId, admin, req }) });
  });

  return router;
}
