import type { RequestHandler, Response } from 'express';
import type { Session, User } from 'lucia';
import { HttpError, unauthorized } from '../http/errors';
import type { Auth } from './lucia';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      user: User | null;
      session: Session | null;
    }
  }
}

/**
 * Reads the session cookie, validates it (lucia's sliding idle expiry plus our absolute cap),
 * and puts the user and session in res.locals. A refreshed or cleared cookie is sent back.
 */
export function sessionMiddleware(auth: Auth, absoluteLifetimeMs: number): RequestHandler {
  return async (req, res, next) => {
    res.locals.user = null;
    res.locals.session = null;
    const sessionId = auth.readSessionCookie(req.headers.cookie ?? '');
    if (!sessionId) return next();
    const { session, user } = await auth.validateSession(sessionId);
    if (session && Date.now() - new Date(session.createdAt).getTime() > absoluteLifetimeMs) {
      await auth.invalidateSession(session.id);
      res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
      return next();
    }
    if (session?.fresh) res.append('Set-Cookie', auth.createSessionCookie(session.id).serialize());
    if (!session) res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
    res.locals.user = user;
    res.locals.session = session;
    next();
  };
}

/** Starts a new session (a fresh id at every sign-in: OWASP ASVS 5.0 7.2.4) and sets its cookie. */
export async function startSession(auth: Auth, res: Response, userId: string) {
  const session = await auth.createSession(userId, { createdAt: new Date() });
  res.append('Set-Cookie', auth.createSessionCookie(session.id).serialize());
  return session;
}

export function requireUser(res: Response): User {
  const user = res.locals.user;
  if (!user) throw unauthorized();
  return user;
}

export function requireAdmin(res: Response): User {
  const user = requireUser(res);
  if (!user.isAdmin) throw new HttpError(404, 'not_found', 'Not found.');
  return user;
}
