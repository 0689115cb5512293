import { desc, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { outbox } from '../db/schema';
import { notFound } from '../http/errors';

/** The mail the local fake SMTP server caught, as the site admin reads it: tokens in links hidden unless `showTokens`. */

/** Long random strings in links (our tokens are 43 characters of base64url). */
const TOKEN = /([?&=/])[A-Za-z0-9_-]{32,}/g;

/** The outbox with every token in it hidden: reading it must not let anyone use a link. */
function maskTokens(text: string): string {
  return text.replace(TOKEN, '$1[hidden]');
}

const shownWith = (showTokens: boolean) => (text: string) => (showTokens ? text : maskTokens(text));

/** The newest 200 messages. */
export async function outboxMessages(db: Db, showTokens: boolean) {
  const shown = shownWith(showTokens);
  const rows = await db
    .select({ id: outbox.id, from: outbox.from, to: outbox.to, subject: outbox.subject, receivedAt: outbox.receivedAt })
    .from(outbox)
    .orderBy(desc(outbox.receivedAt))
    .limit(200);
  return rows.map((r) => ({ ...r, subject: shown(r.subject), receivedAt: r.receivedAt.toISOString() }));
}

export async function outboxMessage(db: Db, id: string, showTokens: boolean) {
  const shown = shownWith(showTokens);
  const [row] = await db.select().from(outbox).where(eq(outbox.id, id));
  if (!row) throw notFound('No such message.');
  return {
    id: row.id,
    from: row.from,
    to: row.to,
    subject: shown(row.subject),
    receivedAt: row.receivedAt.toISOString(),
    text: shown(row.text),
    html: row.html === null ? null : shown(row.html),
  };
}
