import { and, desc, eq, lt, type SQL } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';
import { requireTeamPermission } from '../auth/access';
import { requireAdmin, requireUser } from '../auth/session';
import type { Db } from '../db/client';
import { auditEvents } from '../db/schema';
import { parseOr400 } from '../http/errors';
import type { AppDeps } from '../app-deps';

const auditQuerySchema = z.strictObject({
  before: z.iso.datetime({ message: 'before must be an ISO date-time (UTC)' }).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

async function readAudit(db: Db, teamId: string | null, query: z.output<typeof auditQuerySchema>) {
  const filters: SQL[] = [];
  if (teamId) filters.push(eq(auditEvents.teamId, teamId));
  if (query.before) filters.push(lt(auditEvents.at, new Date(query.before)));
  const rows = await db
    .select()
    .from(auditEvents)
    .where(filters.length ? and(...filters) : undefined)
    .orderBy(desc(auditEvents.at))
    .limit(query.limit);
  return rows.map((r) => ({ ...r, at: r.at.toISOString() }));
}

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
