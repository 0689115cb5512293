import { eq } from 'drizzle-orm';
import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import {
  changePasswordSchema,
  resetConfirmSchema,
  resetRequestSchema,
  signInSchema,
  signUpSchema,
  updateProfileSchema,
} from '../../shared/schemas/account';
import { burnVerifyTime, hashPassword, verifyPassword } from '../auth/passwords';
import { requireUser, startSession } from '../auth/session';
import { hashToken, newToken } from '../auth/tokens';
import { users } from '../db/schema';
import { HttpError, parseOr400 } from '../http/errors';
import { passwordResetMail } from '../mail/templates';
import { consumeResetToken, createAccount, createResetToken, findUserByEmail, meOf, RESET_VALID_MINUTES } from '../services/accounts';
import type { AppDeps } from '../app';
import { audit } from '../services/audit';

function limiter(limit: number, windowMs: number, what: string, skipSuccessfulRequests = false) {
  return rateLimit({
    windowMs,
    limit,
    skipSuccessfulRequests,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res, next) => {
      next(new HttpError(429, 'rate_limited', `Too many ${what} attempts. Wait a few minutes and try again.`, undefined, {
        'Retry-After': String(Math.ceil(windowMs / 1000)),
      }));
    },
  });
}

export function authRouter({ db, auth, config, mailer, logger }: AppDeps): Router {
  const router = Router();
  const window = 15 * 60_000;
  const signInLimit = limiter(config.authRateLimit, window, 'sign-in', true);
  const signUpLimit = limiter(config.authRateLimit, window, 'sign-up');
  const resetLimit = limiter(config.authRateLimit, window, 'password reset');

  router.post('/sign-up', signUpLimit, async (req, res) => {
    const input = parseOr400(signUpSchema, req.body);
    if (await findUserByEmail(db, input.email)) {
      throw new HttpError(409, 'email_taken', 'An account with this e-mail already exists. Sign in, or reset the password.', {
        issues: [{ path: 'email', message: 'is already registered' }],
      });
    }
    const { userId } = await createAccount(db, input);
    await audit(db, { action: 'auth.sign-up', actor: { id: userId, email: input.email }, req });
    await startSession(auth, res, userId);
    res.status(201).json(await meOf(db, userId));
  });

  router.post('/sign-in', signInLimit, async (req, res) => {
    const input = parseOr400(signInSchema, req.body);
    const user = await findUserByEmail(db, input.email);
    const ok = user ? await verifyPassword(user.passwordHash, input.password) : (await burnVerifyTime(input.password), false);
    if (!user || !ok) {
      await audit(db, { action: 'auth.sign-in-failed', actorEmail: input.email, details: { reason: user ? 'wrong password' : 'unknown e-mail' }, req });
      // One answer for an unknown e-mail and a wrong password (OWASP ASVS 5.0 6.3.8).
      throw new HttpError(401, 'invalid_credentials', 'The e-mail or the password is not right.');
    }
    if (res.locals.session) await auth.invalidateSession(res.locals.session.id);
    await startSession(auth, res, user.id);
    await audit(db, { action: 'auth.sign-in', actor: user, req });
    res.json(await meOf(db, user.id));
  });

  router.post('/sign-out', async (_req, res) => {
    if (res.locals.session) await auth.invalidateSession(res.locals.session.id);
    if (res.locals.user) await audit(db, { action: 'auth.sign-out', actor: res.locals.user, req: _req });
    res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
    res.status(204).end();
  });

  router.get('/me', async (_req, res) => {
    const user = requireUser(res);
    res.json(await meOf(db, user.id));
  });

  router.patch('/me', async (req, res) => {
    const user = requireUser(res);
    const input = parseOr400(updateProfileSchema, req.body);
    if (Object.keys(input).length > 0) await db.update(users).set(input).where(eq(users.id, user.id));
    res.json(await meOf(db, user.id));
  });

  router.post('/password', signInLimit, async (req, res) => {
    const user = requireUser(res);
    const input = parseOr400(changePasswordSchema, req.body);
    const [row] = await db.select().from(users).where(eq(users.id, user.id));
    if (!(await verifyPassword(row.passwordHash, input.currentPassword))) {
      throw new HttpError(400, 'invalid_input', 'The current password is not right.', {
        issues: [{ path: 'currentPassword', message: 'is not right' }],
      });
    }
    await db.update(users).set({ passwordHash: await hashPassword(input.newPassword), passwordChangedAt: new Date() }).where(eq(users.id, user.id));
    // A changed password ends every session of the user (OWASP ASVS 5.0 7.4.3); this one gets a new one.
    await auth.invalidateUserSessions(user.id);
    await startSession(auth, res, user.id);
    await audit(db, { action: 'auth.password-changed', actor: user, details: { otherSessionsEnded: true }, req });
    res.json(await meOf(db, user.id));
  });

  router.post('/password-reset', resetLimit, async (req, res) => {
    const input = parseOr400(resetRequestSchema, req.body);
    const user = await findUserByEmail(db, input.email);
    await audit(db, { action: 'auth.password-reset-requested', actorEmail: input.email, details: { knownAddress: Boolean(user) }, req });
    if (user) {
      const { token, tokenHash } = newToken();
      await createResetToken(db, user.id, tokenHash);
      const link = `${config.publicUrl}/reset-password?token=${token}`;
      try {
        await mailer.send(passwordResetMail(user.email, link, RESET_VALID_MINUTES));
      } catch (err) {
        logger.error({ err }, 'password reset mail was not sent');
      }
    }
    // The same answer whether or not the address has an account.
    res.status(202).json({ ok: true });
  });

  router.post('/password-reset/confirm', resetLimit, async (req, res) => {
    const input = parseOr400(resetConfirmSchema, req.body);
    const userId = await consumeResetToken(db, hashToken(input.token));
    if (!userId) {
      throw new HttpError(400, 'invalid_token', 'This reset link is not valid any more: it was used, it expired, or it was mistyped. Ask for a new one.');
    }
    await db.update(users).set({ passwordHash: await hashPassword(input.password), passwordChangedAt: new Date() }).where(eq(users.id, userId));
    await auth.invalidateUserSessions(userId);
    await audit(db, { action: 'auth.password-reset', actor: { id: userId, email: (await db.select({ email: users.email }).from(users).where(eq(users.id, userId)))[0].email }, details: { allSessionsEnded: true }, req });
    res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
    res.status(204).end();
  });

  return router;
}
