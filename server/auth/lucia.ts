import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia, TimeSpan, type Adapter, type DatabaseSession } from 'lucia';
import type { Config } from '../config';
import type { Db } from '../db/client';
import { sessions, users } from '../db/schema';
import { hashToken } from './tokens';

/**
 * lucia's Drizzle adapter with the session id hashed on the way to the database: the cookie holds
 * the id, the `sessions` table only its SHA-256 (OWASP ASVS 5.0 7.2.x, session tokens not stored in
 * the clear). lucia itself only ever sees the id from the cookie, so nothing else changes. The
 * hash is also the handle by which the Sessions page names a session (server/services/sessions.ts).
 */
class HashedSessionAdapter implements Adapter {
  constructor(private readonly inner: Adapter) {}

  async getSessionAndUser(sessionId: string) {
    const [session, user] = await this.inner.getSessionAndUser(hashToken(sessionId));
    return [session ? { ...session, id: sessionId } : null, user] as Awaited<ReturnType<Adapter['getSessionAndUser']>>;
  }
  /** The rows' ids here are the hashes, not ids a cookie could hold. */
  getUserSessions(userId: string): Promise<DatabaseSession[]> {
    return this.inner.getUserSessions(userId);
  }
  setSession(session: DatabaseSession) {
    return this.inner.setSession({ ...session, id: hashToken(session.id) });
  }
  updateSessionExpiration(sessionId: string, expiresAt: Date) {
    return this.inner.updateSessionExpiration(hashToken(sessionId), expiresAt);
  }
  deleteSession(sessionId: string) {
    return this.inner.deleteSession(hashToken(sessionId));
  }
  deleteUserSessions(userId: string) {
    return this.inner.deleteUserSessions(userId);
  }
  deleteExpiredSessions() {
    return this.inner.deleteExpiredSessions();
  }
}

export function createLucia(db: Db, config: Config) {
  const adapter = new HashedSessionAdapter(new DrizzlePostgreSQLAdapter(db, sessions, users));
  return new Lucia(adapter, {
    // lucia extends a session when less than half of this remains: the sliding idle expiry.
    sessionExpiresIn: new TimeSpan(Math.round(config.sessionIdleMs / 1000), 's'),
    sessionCookie: {
      // The __Host- prefix makes browsers insist on Secure, Path=/ and no Domain.
      name: config.secureCookies ? '__Host-spoolbook_session' : 'spoolbook_session',
      expires: true,
      attributes: { secure: config.secureCookies, sameSite: 'lax' },
    },
    getSessionAttributes: (attributes) => ({ createdAt: attributes.createdAt, lastSeenAt: attributes.lastSeenAt, ip: attributes.ip }),
    getUserAttributes: (attributes) => ({
      email: attributes.email,
      name: attributes.name,
      isAdmin: attributes.isAdmin,
      unitSystem: attributes.unitSystem,
      emailConfirmed: attributes.emailConfirmedAt !== null,
      twoFactor: attributes.totpEnabledAt !== null,
    }),
  });
}

export type Auth = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: ReturnType<typeof createLucia>;
    DatabaseSessionAttributes: { createdAt: Date; lastSeenAt: Date; ip: string | null; userAgent?: string | null };
    DatabaseUserAttributes: {
      email: string;
      name: string;
      isAdmin: boolean;
      unitSystem: 'si' | 'us';
      emailConfirmedAt: Date | null;
      totpEnabledAt: Date | null;
    };
  }
}
