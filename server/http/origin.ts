import type { RequestHandler } from 'express';
import { HttpError } from './errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * CSRF defence by origin (OWASP ASVS 5.0 3.5.1–3.5.3): a state-changing request must say it
 * comes from our own origin. Browsers always send Origin or Sec-Fetch-Site on such requests,
 * uploads included. A request with neither is not from a browser; it is let through only when it
 * carries no session cookie, so it cannot ride on someone's session.
 */
export function requireSameOrigin(allowedOrigins: string[], sessionCookieName: string): RequestHandler {
  const allowed = new Set(allowedOrigins);
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const origin = req.get('origin');
    const fetchSite = req.get('sec-fetch-site');
    if (origin !== undefined) {
      if (allowed.has(origin)) return next();
      return next(new HttpError(403, 'bad_origin', `Requests from ${origin} are not accepted. Open Spoolbook at its own address.`));
    }
    if (fetchSite !== undefined) {
      if (fetchSite === 'same-origin' || fetchSite === 'none') return next();
      return next(new HttpError(403, 'bad_origin', 'Cross-site requests are not accepted.'));
    }
    const hasSession = (req.headers.cookie ?? '').split(';').some((c) => c.trim().startsWith(`${sessionCookieName}=`));
    if (hasSession) return next(new HttpError(403, 'bad_origin', 'A signed-in request must carry an Origin header.'));
    next();
  };
}
