import { Router } from 'express';
import { auditQuerySchema } from '#shared/schemas/account';
import type { AppDeps } from '../app-deps';
import { requireTeamPermission } from '../auth/access';
import { requireAdmin, requireUser } from '../auth/session';
import { parseOr400 } from '../http/errors';
import { readAudit } from '../services/audit';

/** The audit record: a team's owners read their team's; the site admin reads everything. */
export function teamAuditRouter({ db }: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.get('/', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, (req.params as { teamId: string }).teamId, 'audit:read');
    res.json({ events: await readAudit(db, access.teamId, parseOr400(auditQuerySchema, { ...req.query }, 'query')) });
  });
  return router;
}

export function adminAuditRouter({ db }: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    requireAdmin(res);
    res.json({ events: await readAudit(db, null, parseOr400(auditQuerySchema, { ...req.query }, 'query')) });
  });
  return router;
}
