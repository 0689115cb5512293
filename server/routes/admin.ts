import { and, count, desc, eq, gt, ilike, max, or } from 'drizzle-orm';
import { Router } from 'express';
import { requireAdmin } from '../auth/session';
import { outbox, sessions, users } from '../db/schema';
import { notFound } from '../http/errors';
import { audit } from '../services/audit';
import { endAllSessions } from '../services/sessions';
import type { AppDeps } from '../app-deps';

/** Long random strings in links (our tokens are 43 characters of base64url). */
const TOKEN = /([?&=/])[A-Za-z0-9_-]{32,}/g;

/** The outbox with every token in it hidden: reading it must not let anyone use a link. */
export function maskTokens(text: string): string {
  return text.replace(TOKEN, '$1[hidden]');
}

/** Site-admin pages: the mail outbox of the local fake SMTP server, and users' sessions. Others get 404. */
export function adminRouter({ db, config }: AppDeps): Router {
  const router = Router();
  router.use((_req, res, next) => {
    requireAdmin(res);
    next();
  });
  // Tokens show only where nobody else's mail can be: development with the local mail catcher.
  const showTokens = config.development && !config.smtpUrl;
  const shown = (text: string) => (showTokens ? text : maskTokens(text));

  router.get('/outbox', async (_req, res) => {
    const rows = await db
      .select({ id: outbox.id, from: outbox.from, to: outbox.to, subject: outbox.subject, receivedAt: outbox.receivedAt })
      .from(outbox)
      .orderBy(desc(outbox.receivedAt))
      .limit(200);
    res.json({ messages: rows.map((r) => ({ ...r, subject: shown(r.subject), receivedAt: r.receivedAt.toISOString() })), tokensHidden: !showTokens });
  });

  router.get('/outbox/:id', async (req, res) => {
    const [row] = await db.select().from(outbox).where(eq(outbox.id, req.params.id));
    if (!row) throw notFound('No such message.');
    res.json({
      message: {
        id: row.id,
        from: row.from,
        to: row.to,
        subject: shown(row.subject),
        receivedAt: row.receivedAt.toISOString(),
        text: shown(row.text),
        html: row.html === null ? null : shown(row.html),
      },
      tokensHidden: !showTokens,
    });
  });

  router.get('/users', async (req, res) => {
    const q = typeof req.query.q === 'string' ? req.query.q.trim().slice(0, 100) : '';
    const pattern = `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    // Only sessions that still work count, as on the user's own Sessions page.
    const live = and(eq(sessions.userId, users.id), gt(sessions.expiresAt, new Date()));
    const rows = await db
      .select({
        id: users.id,
        email: users.email,
        name: users.name,
        isAdmin: users.isAdmin,
        totpEnabledAt: users.totpEnabledAt,
        emailConfirmedAt: users.emailConfirmedAt,
        sessions: count(sessions.id),
        lastSeenAt: max(sessions.lastSeenAt),
      })
      .from(users)
      .leftJoin(sessions, live)
      .where(q ? or(ilike(users.email, pattern), ilike(users.name, pattern)) : undefined)
      .groupBy(users.id)
      .orderBy(users.email)
      .limit(100);
    res.json({
      users: rows.map((r) => ({
        id: r.id,
        email: r.email,
        name: r.name,
        isAdmin: r.isAdmin,
        twoFactor: r.totpEnabledAt !== null,
        emailConfirmed: r.emailConfirmedAt !== null,
        sessions: r.sessions,
        lastSeenAt: r.lastSeenAt ? new Date(r.lastSeenAt).toISOString() : null,
      })),
    });
  });

  router.post('/users/:userId/end-sessions', async (req, res) => {
    const admin = requireAdmin(res);
    const [target] = await db.select({ id: users.id, email: users.email }).from(users).where(eq(users.id, req.params.userId));
    if (!target) throw notFound('No such user.');
    const ended = await endAllSessions(db, target.id);
    await audit(db, { action: 'admin.sessions-ended', actor: admin, targetType: 'user', targetId: target.id, details: { ended, email: target.email }, req });
    res.json({ ended });
  });

  return router;
}
