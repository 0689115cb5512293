import Bowser from 'bowser';
import { and, desc, eq, ne } from 'drizzle-orm';
import { hashToken } from '../auth/tokens';
import type { Db } from '../db/client';
import { sessions } from '../db/schema';

/**
 * The Sessions page: a user's sessions, named by the SHA-256 of their id (what the table holds;
 * it cannot be turned back into a cookie), with when, where from and which browser.
 */
export interface SessionView {
  id: string;
  current: boolean;
  createdAt: string;
  lastSeenAt: string;
  ip: string | null;
  browser: string;
}

/** "Firefox 128 on Linux" from a User-Agent header; "Unknown browser" when there is none. */
function describeBrowser(userAgent: string | null): string {
  if (!userAgent) return 'Unknown browser';
  const parsed = Bowser.parse(userAgent);
  const name = parsed.browser.name ? `${parsed.browser.name}${parsed.browser.version ? ` ${parsed.browser.version.split('.')[0]}` : ''}` : null;
  const os = parsed.os.name ?? null;
  if (!name) return userAgent.slice(0, 60);
  return os ? `${name} on ${os}` : name;
}

export async function sessionsOf(db: Db, userId: string, currentSessionId: string | null): Promise<SessionView[]> {
  const current = currentSessionId ? hashToken(currentSessionId) : null;
  const rows = await db
    .select()
    .from(sessions)
    .where(and(eq(sessions.userId, userId)))
    .orderBy(desc(sessions.lastSeenAt));
  return rows
    .filter((r) => r.expiresAt.getTime() > Date.now())
    .map((r) => ({
      id: r.id,
      current: r.id === current,
      createdAt: r.createdAt.toISOString(),
      lastSeenAt: r.lastSeenAt.toISOString(),
      ip: r.ip,
      browser: describeBrowser(r.userAgent),
    }));
}

/** Ends one of the user's sessions by its handle; false when the user has no such session. */
export async function endSession(db: Db, userId: string, handle: string): Promise<boolean> {
  const rows = await db
    .delete(sessions)
    .where(and(eq(sessions.userId, userId), eq(sessions.id, handle)))
    .returning({ id: sessions.id });
  return rows.length === 1;
}

/** Ends every session of the user but the one given; returns how many ended. */
export async function endOtherSessions(db: Db, userId: string, currentSessionId: string): Promise<number> {
  const rows = await db
    .delete(sessions)
    .where(and(eq(sessions.userId, userId), ne(sessions.id, hashToken(currentSessionId))))
    .returning({ id: sessions.id });
  return rows.length;
}

/** Notes when and from which address a session was last used (shown on the Sessions page). */
export async function noteSessionUse(db: Db, sessionId: string, ip: string) {
  await db
    .update(sessions)
    .set({ lastSeenAt: new Date(), ip })
    .where(eq(sessions.id, hashToken(sessionId)));
}

export async function endAllSessions(db: Db, userId: string): Promise<number> {
  const rows = await db.delete(sessions).where(eq(sessions.userId, userId)).returning({ id: sessions.id });
  return rows.length;
}
