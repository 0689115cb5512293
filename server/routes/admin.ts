import { desc, eq } from 'drizzle-orm';
import { Router } from 'express';
import { requireAdmin } from '../auth/session';
import { outbox } from '../db/schema';
import { notFound } from '../http/errors';
import type { AppDeps } from '../app';

/** Site-admin pages: the mail outbox of the local fake SMTP server. Others get 404. */
export function adminRouter({ db }: AppDeps): Router {
  const router = Router();
  router.use((_req, res, next) => {
    requireAdmin(res);
    next();
  });

  router.get('/outbox', async (_req, res) => {
    const rows = await db
      .select({ id: outbox.id, from: outbox.from, to: outbox.to, subject: outbox.subject, receivedAt: outbox.receivedAt })
      .from(outbox)
      .orderBy(desc(outbox.receivedAt))
      .limit(200);
    res.json({ messages: rows.map((r) => ({ ...r, receivedAt: r.receivedAt.toISOString() })) });
  });

  router.get('/outbox/:id', async (req, res) => {
    const [row] = await db.select().from(outbox).where(eq(outbox.id, req.params.id));
    if (!row) throw notFound('No such message.');
    res.json({
      message: { id: row.id, from: row.from, to: row.to, subject: row.subject, receivedAt: row.receivedAt.toISOString(), text: row.text, html: row.html },
    });
  });

  return router;
}
