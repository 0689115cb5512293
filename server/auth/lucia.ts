import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia, TimeSpan } from 'lucia';
import type { Config } from '../config';
import type { Db } from '../db/client';
import { sessions, users } from '../db/schema';

export function createLucia(db: Db, config: Config) {
  const adapter = new DrizzlePostgreSQLAdapter(db, sessions, users);
  return new Lucia(adapter, {
    // lucia extends a session when less than half of this remains: the sliding idle expiry.
    sessionExpiresIn: new TimeSpan(Math.round(config.sessionIdleMs / 1000), 's'),
    sessionCookie: {
      // The __Host- prefix makes browsers insist on Secure, Path=/ and no Domain.
      name: config.secureCookies ? '__Host-spoolbook_session' : 'spoolbook_session',
      expires: true,
      attributes: { secure: config.secureCookies, sameSite: 'lax' },
    },
    getSessionAttributes: (attributes) => ({ createdAt: attributes.createdAt }),
    getUserAttributes: (attributes) => ({
      email: attributes.email,
      name: attributes.name,
      isAdmin: attributes.isAdmin,
      unitSystem: attributes.unitSystem,
    }),
  });
}

export type Auth = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: ReturnType<typeof createLucia>;
    DatabaseSessionAttributes: { createdAt: Date };
    DatabaseUserAttributes: { email: string; name: string; isAdmin: boolean; unitSystem: 'si' | 'us' };
  }
}
