import { eq, sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import { newId } from '../auth/tokens';
import type { Db, Tx } from '../db/client';
import { mailQueue } from '../db/schema';
import type { MailMessage, Mailer } from './mailer';

/** Puts a message in the queue (inside the caller's transaction when given one). */
export async function enqueueMail(db: Db | Tx, message: MailMessage): Promise<void> {
  await db.insert(mailQueue).values({ id: newId(), to: message.to, subject: message.subject, text: message.text, html: message.html ?? null });
}

/** Attempts before a message is given up (logged); waits between them double from 30 s. */
const MAX_ATTEMPTS = 6;
const BATCH = 10;
/** Longest `drain` waits for messages another instance has claimed, ms. */
const DRAIN_WAIT_MS = 5_000;

export interface MailWorker {
  /** Looks at the queue now instead of at the next tick. */
  kick(): void;
  /** Work started after answering (see `later`) and every message due now: done. Tests use this. */
  drain(): Promise<void>;
  /** Runs work after the answer went out; its errors are logged, never sent to a client. */
  later(what: string, work: () => Promise<void>): void;
  stop(): void;
}

/**
 * Sends queued mail from this process. Every instance runs one; a message is claimed by moving its
 * next attempt into the future in one statement over rows locked with SKIP LOCKED, so two
 * instances never send the same message, and a process that dies mid-send leaves it to be retried.
 */
export function startMailWorker(db: Db, mailer: Mailer, logger: Logger, intervalMs = 2_000): MailWorker {
  let stopped = false;
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<void> | null = null;
  const pending = new Set<Promise<void>>();

  async function sendDue(): Promise<number> {
    const claimed = await db.execute<{ id: string; to: string; subject: string; text: string; html: string | null; attempts: number }>(sql`
      UPDATE mail_queue SET attempts = attempts + 1,
        next_attempt_at = now() + make_interval(secs => 30 * power(2, attempts))
      WHERE id IN (
        SELECT id FROM mail_queue
        WHERE sent_at IS NULL AND next_attempt_at <= now() AND attempts < ${MAX_ATTEMPTS}
        ORDER BY created_at LIMIT ${BATCH} FOR UPDATE SKIP LOCKED)
      RETURNING id, "to", subject, text, html, attempts`);
    for (const m of claimed.rows) {
      try {
        await mailer.send({ to: m.to, subject: m.subject, text: m.text, ...(m.html ? { html: m.html } : {}) });
        await db.update(mailQueue).set({ sentAt: new Date(), lastError: null }).where(eq(mailQueue.id, m.id));
      } catch (err) {
        const message = (err as Error).message ?? String(err);
        await db
          .update(mailQueue)
          .set({ lastError: message.slice(0, 500) })
          .where(eq(mailQueue.id, m.id));
        // The address is personal data, the subject may name a team: log the id only.
        logger[m.attempts >= MAX_ATTEMPTS ? 'error' : 'warn'](
          { mailId: m.id, attempt: m.attempts, err: message },
          m.attempts >= MAX_ATTEMPTS ? 'mail given up' : 'mail not sent; will retry',
        );
      }
    }
    return claimed.rows.length;
  }

  /** Messages some worker has claimed and neither sent nor failed yet. */
  async function inFlight(): Promise<number> {
    const r = await db.execute<{ n: number }>(
      sql`SELECT count(*)::int AS n FROM mail_queue WHERE sent_at IS NULL AND last_error IS NULL AND attempts > 0 AND next_attempt_at > now()`,
    );
    return r.rows[0]?.n ?? 0;
  }

  function runOnce(): Promise<void> {
    running ??= (async () => {
      try {
        while (!stopped && (await sendDue()) === BATCH);
      } catch (err) {
        logger.warn({ err: (err as Error).message }, 'mail queue not reachable');
      } finally {
        running = null;
      }
    })();
    return running;
  }

  function schedule() {
    if (stopped) return;
    timer = setTimeout(() => void runOnce().finally(schedule), intervalMs);
    timer.unref();
  }
  schedule();

  return {
    kick() {
      if (!stopped) setImmediate(() => void runOnce());
    },
    async drain() {
      while (pending.size) await Promise.allSettled([...pending]);
      // A kick may be about to run: let it, then send whatever is still due.
      await new Promise((r) => setImmediate(r));
      if (running) await running;
      while (!stopped && (await sendDue()) > 0);
      // Another instance on the same database may have claimed some of these messages: wait (a
      // little) until nothing claimed is still on its way, so the caller finds them delivered.
      const deadline = Date.now() + DRAIN_WAIT_MS;
      while (!stopped && Date.now() < deadline && (await inFlight()) > 0) await new Promise((r) => setTimeout(r, 25));
    },
    later(what, work) {
      const p = new Promise<void>((resolve) => setImmediate(resolve))
        .then(work)
        .catch((err) => logger.error({ err: (err as Error).message }, `${what} failed after answering`))
        .finally(() => pending.delete(p));
      pending.add(p);
    },
    stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
    },
  };
}
