import { Router, type Request, type Response } from 'express';
import {
  changePasswordSchema,
  confirmEmailSchema,
  confirmPasswordSchema,
  enableTwoFactorSchema,
  resetConfirmSchema,
  resetRequestSchema,
  secondFactorSignInSchema,
  signInSchema,
  signUpSchema,
  updateProfileSchema,
} from '#shared/schemas/account';
import type { AppDeps } from '../app-deps';
import { clientAddress, requireUser, startSession } from '../auth/session';
import { hashToken } from '../auth/tokens';
import { HttpError, parseOr400 } from '../http/errors';
import { confirmEmail, createAccount, emailOf, findUserByEmail, meOf, sendConfirmationLink, updateProfile } from '../services/accounts';
import { audit } from '../services/audit';
import { DEMO_USER } from '../services/demo';
import { assertSignInAllowed, signInFailed, signInSucceeded, tooMany } from '../services/limits';
import { assertCurrentPassword, assertStrongPassword, changePassword, checkPassword, liveResetUser, mailResetLink, resetPassword } from '../services/passwords';
import { endOtherSessions, endSession, sessionsOf } from '../services/sessions';
import {
  acceptCode,
  acceptSecondFactor,
  beginTwoFactor,
  challengeUser,
  createChallenge,
  enableTwoFactor,
  endChallenge,
  newRecoveryCodes,
  recoveryCodesLeft,
  setupStarted,
  turnOffTwoFactor,
} from '../services/two-factor';

export function authRouter(deps: AppDeps): Router {
  const { db, auth, limits, mail } = deps;
  const router = Router();

  async function signedIn(req: Request, res: Response, userId: string, email: string) {
    if (res.locals.session) await auth.invalidateSession(res.locals.session.id);
    await startSession(auth, req, res, userId);
    await audit(db, { action: 'auth.sign-in', actor: { id: userId, email }, req });
    res.json(await meOf(db, userId));
  }

  router.post('/sign-up', async (req, res) => {
    await limits.signUpByAddress.take(clientAddress(req));
    const input = parseOr400(signUpSchema, req.body);
    assertStrongPassword(input.password, 'password', input);
    if (await findUserByEmail(db, input.email)) {
      throw new HttpError(409, 'email_taken', 'An account with this e-mail already exists. Sign in, or reset the password.', {
        issues: [{ path: 'email', message: 'is already registered' }],
      });
    }
    const { userId } = await createAccount(db, input);
    await audit(db, { action: 'auth.sign-up', actor: { id: userId, email: input.email }, req });
    await sendConfirmationLink(deps, userId, input.email);
    await startSession(auth, req, res, userId);
    res.status(201).json(await meOf(db, userId));
  });

  router.post('/confirm-email', async (req, res) => {
    const input = parseOr400(confirmEmailSchema, req.body);
    const userId = await confirmEmail(db, hashToken(input.token));
    if (!userId)
      throw new HttpError(
        400,
        'invalid_token',
        'This confirmation link is not valid any more: it was used, it expired, or a newer one was sent. Sign in and have a new one sent from Settings.',
      );
    const email = await emailOf(db, userId);
    await audit(db, { action: 'auth.email-confirmed', actor: { id: userId, email }, req });
    res.json({ confirmed: true, email });
  });

  router.post('/confirm-email/resend', async (_req, res) => {
    const user = requireUser(res);
    if (user.emailConfirmed) return void res.json({ sent: false, confirmed: true });
    const sent = await sendConfirmationLink(deps, user.id, user.email);
    if (!sent) throw tooMany('The confirmation link was sent several times in the last hour.', 3600_000);
    res.status(202).json({ sent: true });
  });

  router.post('/sign-in', async (req, res) => {
    const input = parseOr400(signInSchema, req.body);
    const address = clientAddress(req);
    await assertSignInAllowed(limits, input.email, address);
    const { user, ok } = await checkPassword(db, input.email, input.password);
    if (!user || !ok) {
      await signInFailed(limits, input.email, address);
      await audit(db, { action: 'auth.sign-in-failed', actorEmail: input.email, details: { reason: user ? 'wrong password' : 'unknown e-mail' }, req });
      // One answer for an unknown e-mail and a wrong password (OWASP ASVS 5.0 6.3.8).
      throw new HttpError(401, 'invalid_credentials', 'The e-mail or the password is not right.');
    }
    if (user.totpEnabledAt) {
      // The password was right; the session waits for the second factor (OWASP ASVS 5.0 6.3.3).
      return void res.json({ secondFactor: true, challenge: await createChallenge(db, user.id) });
    }
    await signInSucceeded(limits, input.email, address);
    await signedIn(req, res, user.id, user.email);
  });

  router.post('/sign-in/second-factor', async (req, res) => {
    const input = parseOr400(secondFactorSignInSchema, req.body);
    const userId = await challengeUser(db, input.challenge);
    if (!userId) throw new HttpError(401, 'challenge_expired', 'This sign-in took too long or had too many wrong codes. Sign in again with your password.');
    const email = await emailOf(db, userId);
    const address = clientAddress(req);
    await assertSignInAllowed(limits, email, address);
    const used = await acceptSecondFactor(db, userId, input.code);
    if (!used) {
      await signInFailed(limits, email, address);
      await audit(db, { action: 'auth.second-factor-failed', actor: { id: userId, email }, req });
      throw new HttpError(401, 'invalid_code', 'That code is not right, or it was used already. Try the newest code your app shows, or a recovery code.', {
        issues: [{ path: 'code', message: 'is not right' }],
      });
    }
    await endChallenge(db, input.challenge);
    await signInSucceeded(limits, email, address);
    if (used === 'recovery')
      await audit(db, {
        action: 'auth.recovery-code-used',
        actor: { id: userId, email },
        details: { left: await recoveryCodesLeft(db, userId) },
        req,
      });
    await signedIn(req, res, userId, email);
  });

  router.post('/sign-out', async (req, res) => {
    if (res.locals.session) await auth.invalidateSession(res.locals.session.id);
    if (res.locals.user) await audit(db, { action: 'auth.sign-out', actor: res.locals.user, req });
    res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
    // The browser drops what it kept of this account (OWASP ASVS 5.0 7.4.x).
    res.set('Clear-Site-Data', '"cache", "cookies", "storage"');
    res.status(204).end();
  });

  // Who is signed in, answered 200 either way: a signed-out visitor's page asks without a 401
  // in the browser's console. `demo`: the demo sign-in below is open (development only).
  router.get('/session', async (_req, res) => {
    const user = res.locals.user;
    res.json({ me: user ? await meOf(db, user.id) : null, demo: deps.config.development });
  });

  // One click into the demo for a visitor of a development server (`npm start` on loopback),
  // where the demo account's password is published anyway. Anywhere else it does not exist.
  router.post('/demo-sign-in', async (req, res) => {
    if (!deps.config.development) throw new HttpError(404, 'not_found', 'There is no demo on this server. Create an account instead.');
    const user = await findUserByEmail(db, DEMO_USER.email);
    if (!user) throw new HttpError(404, 'not_found', 'The demo account is not there (run npm start to seed it).');
    if (user.totpEnabledAt) throw new HttpError(409, 'second_factor', 'The demo account has a second factor turned on: sign in with the form.');
    await signedIn(req, res, user.id, user.email);
  });

  router.get('/me', async (_req, res) => {
    const user = requireUser(res);
    res.json(await meOf(db, user.id));
  });

  router.patch('/me', async (req, res) => {
    const user = requireUser(res);
    const input = parseOr400(updateProfileSchema, req.body);
    await updateProfile(db, user.id, input);
    res.json(await meOf(db, user.id));
  });

  router.post('/password', async (req, res) => {
    const user = requireUser(res);
    const input = parseOr400(changePasswordSchema, req.body);
    await assertCurrentPassword(deps, user, input.currentPassword, 'currentPassword', clientAddress(req));
    assertStrongPassword(input.newPassword, 'newPassword', user);
    await changePassword(db, user.id, input.newPassword);
    // A changed password ends every session of the user (OWASP ASVS 5.0 7.4.3) and every reset link; this one gets a new session.
    await auth.invalidateUserSessions(user.id);
    await startSession(auth, req, res, user.id);
    await audit(db, { action: 'auth.password-changed', actor: user, details: { otherSessionsEnded: true }, req });
    res.json(await meOf(db, user.id));
  });

  router.post('/password-reset', async (req, res) => {
    const input = parseOr400(resetRequestSchema, req.body);
    const address = clientAddress(req);
    await limits.resetByAddress.take(address);
    // Answer first, then look the address up and queue the mail: the answer and its timing are
    // the same whether or not the address has an account (OWASP ASVS 5.0 6.3.8).
    res.status(202).json({ ok: true });
    mail.later('password reset request', () => mailResetLink(deps, input.email, req));
  });

  router.post('/password-reset/confirm', async (req, res) => {
    await limits.resetByAddress.take(clientAddress(req));
    const input = parseOr400(resetConfirmSchema, req.body);
    const tokenHash = hashToken(input.token);
    const invalid = () =>
      new HttpError(
        400,
        'invalid_token',
        'This reset link is not valid any more: it was used, it expired, a newer one was sent, or it was mistyped. Ask for a new one.',
      );
    const owner = await liveResetUser(db, tokenHash);
    if (!owner) throw invalid();
    assertStrongPassword(input.password, 'password', owner);
    const userId = await resetPassword(db, tokenHash, input.password);
    if (!userId) throw invalid();
    await auth.invalidateUserSessions(userId);
    await limits.signInByAccount.succeeded(owner.email);
    await audit(db, { action: 'auth.password-reset', actor: { id: userId, email: owner.email }, details: { allSessionsEnded: true }, req });
    res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
    res.status(204).end();
  });

  // --- Sessions page ---------------------------------------------------------------------------

  router.get('/sessions', async (_req, res) => {
    const user = requireUser(res);
    res.json({ sessions: await sessionsOf(db, user.id, res.locals.session?.id ?? null) });
  });

  router.post('/sessions/end-others', async (req, res) => {
    const user = requireUser(res);
    const ended = await endOtherSessions(db, user.id, res.locals.session!.id);
    await audit(db, { action: 'auth.sessions-ended', actor: user, details: { ended, which: 'others' }, req });
    res.json({ ended });
  });

  router.delete('/sessions/:sessionId', async (req, res) => {
    const user = requireUser(res);
    const handle = String(req.params.sessionId);
    if (!/^[0-9a-f]{64}$/.test(handle) || !(await endSession(db, user.id, handle))) throw new HttpError(404, 'not_found', 'No such session of yours.');
    await audit(db, { action: 'auth.sessions-ended', actor: user, details: { ended: 1, which: 'one' }, req });
    if (res.locals.session && hashToken(res.locals.session.id) === handle) res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
    res.status(204).end();
  });

  // --- Second factor ---------------------------------------------------------------------------

  router.get('/two-factor', async (_req, res) => {
    const user = requireUser(res);
    res.json({ enabled: user.twoFactor, recoveryCodesLeft: user.twoFactor ? await recoveryCodesLeft(db, user.id) : 0 });
  });

  router.post('/two-factor/setup', async (req, res) => {
    const user = requireUser(res);
    if (user.twoFactor) throw new HttpError(409, 'already_on', 'The second factor is on already. Turn it off first to move it to another app.');
    const input = parseOr400(confirmPasswordSchema, req.body);
    await assertCurrentPassword(deps, user, input.password, 'password', clientAddress(req));
    res.json(await beginTwoFactor(db, user));
  });

  router.post('/two-factor/enable', async (req, res) => {
    const user = requireUser(res);
    if (user.twoFactor) throw new HttpError(409, 'already_on', 'The second factor is on already.');
    const input = parseOr400(enableTwoFactorSchema, req.body);
    if (!(await setupStarted(db, user.id))) throw new HttpError(409, 'not_started', 'Start the set-up first: it shows the code to scan.');
    if (!(await acceptCode(db, user.id, input.code))) {
      throw new HttpError(400, 'invalid_code', 'That code is not right. Check the time on your phone and enter the newest code.', {
        issues: [{ path: 'code', message: 'is not right' }],
      });
    }
    const recoveryCodes = await enableTwoFactor(db, user.id);
    // Sessions opened without the second factor end; this one carries on.
    await endOtherSessions(db, user.id, res.locals.session!.id);
    await audit(db, { action: 'auth.two-factor-on', actor: user, req });
    res.json({ recoveryCodes });
  });

  router.post('/two-factor/recovery-codes', async (req, res) => {
    const user = requireUser(res);
    if (!user.twoFactor) throw new HttpError(409, 'not_on', 'The second factor is off.');
    const input = parseOr400(confirmPasswordSchema, req.body);
    await assertCurrentPassword(deps, user, input.password, 'password', clientAddress(req));
    const recoveryCodes = await newRecoveryCodes(db, user.id);
    await audit(db, { action: 'auth.recovery-codes-renewed', actor: user, req });
    res.json({ recoveryCodes });
  });

  router.post('/two-factor/disable', async (req, res) => {
    const user = requireUser(res);
    const input = parseOr400(confirmPasswordSchema, req.body);
    await assertCurrentPassword(deps, user, input.password, 'password', clientAddress(req));
    await turnOffTwoFactor(db, user.id);
    await audit(db, { action: 'auth.two-factor-off', actor: user, req });
    res.json(await meOf(db, user.id));
  });

  return router;
}
