import type { Request, RequestHandler, Response } from 'express';
import type { Session, User } from 'lucia';
import type { Db } from '../db/client';
import { HttpError, unauthorized } from '../http/errors';
import { noteSessionUse } from '../services/sessions';
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

/** How often a session's "last seen" time and address are written, at most. */
const LAST_SEEN_EVERY_MS = 60_000;

/** The client's address as Express sees it (TRUST_PROXY decides whether a proxy's header counts). */
export function clientAddress(req: Request): string {
  return req.ip ?? req.socket.remoteAddress ?? 'unknown';
}

/**
 * Reads the session cookie, validates it (lucia's sliding idle expiry plus our absolute cap),
 * and puts the user and session in res.locals. A refreshed or cleared cookie is sent back.
 * Notes when and from where the session was last used, at most once a minute.
 */
export function sessionMiddleware(auth: Auth, absoluteLifetimeMs: number, db: Db): RequestHandler {
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
    if (session) {
      const ip = clientAddress(req);
      if (Date.now() - new Date(session.lastSeenAt).getTime() > LAST_SEEN_EVERY_MS || session.ip !== ip) {
        await noteSessionUse(db, session.id, ip);
      }
    }
    res.locals.user = user;
    res.locals.session = session;
    next();
  };
}

/** Starts a new session (a fresh id at every sign-in: OWASP ASVS 5.0 7.2.4) and sets its cookie. */
export async function startSession(auth: Auth, req: Request, res: Response, userId: string) {
  const now = new Date();
  const session = await auth.createSession(userId, {
    createdAt: now,
    lastSeenAt: now,
    ip: clientAddress(req),
    userAgent: (req.get('user-agent') ?? '').slice(0, 300) || null,
  });
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

/** Sending invitations, creating and joining teams need an address that has been confirmed. */
export function requireConfirmedEmail(user: User) {
  if (!user.emailConfirmed) {
    throw new HttpError(
      403,
      'email_unconfirmed',
      `Confirm your e-mail address first: open the link we sent to ${user.email}. You can have it sent again from Settings.`,
    );
  }
}
