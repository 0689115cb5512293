import { createHash } from 'node:crypto';
import { desc, eq } from 'drizzle-orm';
import { generate } from 'otplib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '#server/config';
import { outbox, passwordResets, sessions, users } from '#server/db/schema';
import { ADMIN_USER } from '#server/services/demo';
import type { MailMessage, Mailer } from '#server/mail/mailer';
import {
  client,
  confirmAddress,
  expectErrorShape,
  latestLinkTo,
  latestMailTo,
  linkIn,
  ORIGIN,
  PASSWORD,
  signedUp,
  startTestApp,
  uniqueEmail,
  type TestApp,
} from './helpers';

// Each test reproduces an attack from the security review of issue 14 and shows it refused.
// OWASP ASVS 5.0 ids are named beside the checks.

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t?.close();
});

const tokenOf = (link: string) => new URL(link).searchParams.get('token')!;
const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');
const sessionCookie = (res: request.Response) =>
  (res.headers['set-cookie'] as unknown as string[] | undefined)
    ?.find((c) => c.startsWith('spoolbook_session=') && !c.startsWith('spoolbook_session=;'))
    ?.split(';')[0];

describe('reset links (ASVS 6.3.x, 6.4.x)', () => {
  it('only the newest link works; using it ends every link', async () => {
    const { email } = await signedUp(t, 'reset-one');
    await client(t).post('/api/auth/password-reset', { email });
    const first = tokenOf(linkIn((await latestMailTo(t, email)).text, '/reset-password?token='));
    await client(t).post('/api/auth/password-reset', { email });
    const second = tokenOf(linkIn((await latestMailTo(t, email)).text, '/reset-password?token='));
    expect(second).not.toBe(first);
    // The attack: 25 requests left 25 live links. Now the older one is dead at once.
    const old = await client(t).post('/api/auth/password-reset/confirm', { token: first, password: 'a brand new password' });
    expect(old.status).toBe(400);
    expect(old.body.error.code).toBe('invalid_token');
    expect((await client(t).post('/api/auth/password-reset/confirm', { token: second, password: 'a brand new password' })).status).toBe(204);
    const [user] = await t.database.db.select({ id: users.id }).from(users).where(eq(users.email, email));
    const live = (await t.database.db.select().from(passwordResets).where(eq(passwordResets.userId, user.id))).filter((r) => r.usedAt === null);
    expect(live).toEqual([]);
  });

  it('changing the password ends a live reset link', async () => {
    const { c, email } = await signedUp(t, 'reset-change');
    await client(t).post('/api/auth/password-reset', { email });
    const token = tokenOf(linkIn((await latestMailTo(t, email)).text, '/reset-password?token='));
    expect((await c.post('/api/auth/password', { currentPassword: PASSWORD, newPassword: 'a brand new password' })).status).toBe(200);
    expect((await client(t).post('/api/auth/password-reset/confirm', { token, password: 'yet another password' })).status).toBe(400);
  });

  it('answers before the address is looked up or any mail is sent: same answer, known or not (ASVS 6.3.8)', async () => {
    // A mailer that holds every message until released: the answer must not wait for it.
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const sent: MailMessage[] = [];
    const held: Mailer = { send: async (m) => void (await gate, sent.push(m)), close: () => undefined };
    const { createApp } = await import('#server/app');
    const pino = (await import('pino')).default;
    const { app, deps } = createApp({
      database: t.database,
      config: t.config,
      mailer: held,
      logger: pino({ level: 'silent' }),
      rateLimitNamespace: `held-${Date.now()}:`,
    });
    try {
      const { email } = await signedUp(t, 'reset-held');
      const known = await request(app).post('/api/auth/password-reset').set('Origin', ORIGIN).send({ email });
      const unknown = await request(app)
        .post('/api/auth/password-reset')
        .set('Origin', ORIGIN)
        .send({ email: uniqueEmail('nobody') });
      expect(known.status).toBe(202);
      expect(known.text).toBe(unknown.text);
      expect(sent).toEqual([]); // answered while the mail was still held
      release();
      await deps.mail.drain();
      expect(sent.map((m) => m.to)).toEqual([email]);
    } finally {
      release();
      deps.mail.stop();
    }
  });

  it('limits requests per address (429) and mails per account (silently)', async () => {
    const limited = await startTestApp({}, { resetsPerAddress: 3, resetsPerAccount: 2 });
    try {
      const { email } = await signedUp(limited, 'reset-limit');
      const statuses: number[] = [];
      for (let i = 0; i < 4; i++) statuses.push((await client(limited).post('/api/auth/password-reset', { email })).status);
      expect(statuses).toEqual([202, 202, 202, 429]); // 3 per address per 15 minutes in this test's settings
      await limited.drainMail();
      const mails = (await limited.database.db.select().from(outbox).where(eq(outbox.to, email))).filter((m) => /Reset/.test(m.subject));
      expect(mails).toHaveLength(2); // 2 mails per account per hour in this test's settings
    } finally {
      await limited.close();
    }
  });
});

describe('passwords (ASVS 6.2.4, 6.2.11)', () => {
  it.each(['password', '12345678', 'qwertyuiop', 'iloveyou1'])('refuses the common password %s at sign-up', async (password) => {
    const res = await client(t).post('/api/auth/sign-up', { email: uniqueEmail('weak'), password, name: 'Weak Pass' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('weak_password');
    expect(res.body.error.details.issues[0].path).toBe('password');
  });

  it('refuses a password built from the e-mail address or the product name', async () => {
    const email = uniqueEmail('quentin');
    const fromEmail = await client(t).post('/api/auth/sign-up', { email, password: `${email.split('@')[0]}-rocks-99`, name: 'Quentin' });
    expect(fromEmail.status).toBe(400);
    expect(fromEmail.body.error.message).toMatch(/e-mail/);
    const product = await client(t).post('/api/auth/sign-up', { email, password: 'Spoolbook-2024-winter', name: 'Quentin' });
    expect(product.status).toBe(400);
    expect(product.body.error.message).toMatch(/product/);
  });

  it('applies the same check when changing and resetting a password', async () => {
    const { c, email } = await signedUp(t, 'weak-change');
    const change = await c.post('/api/auth/password', { currentPassword: PASSWORD, newPassword: 'password1' });
    expect(change.status).toBe(400);
    expect(change.body.error.details.issues[0].path).toBe('newPassword');
    await client(t).post('/api/auth/password-reset', { email });
    const token = tokenOf(linkIn((await latestMailTo(t, email)).text, '/reset-password?token='));
    const reset = await client(t).post('/api/auth/password-reset/confirm', { token, password: '123456789' });
    expect(reset.status).toBe(400);
    // A refused password does not use the link up.
    expect((await client(t).post('/api/auth/password-reset/confirm', { token, password: 'a brand new password' })).status).toBe(204);
  });
});

describe('sign-in throttling per account and per address (ASVS 6.3.1)', () => {
  let limited: TestApp;
  beforeAll(async () => {
    // Client addresses from X-Forwarded-For, as behind a load balancer.
    limited = await startTestApp({ trustProxy: 'loopback' }, { signInFreeFailures: 3, signInFreeFailuresPerAddress: 5 });
  });
  afterAll(() => limited.close());
  const from = (address: string, email: string, password: string) =>
    request(limited.app).post('/api/auth/sign-in').set('Origin', ORIGIN).set('X-Forwarded-For', address).send({ email, password });

  it('guesses from many addresses slow the account down (growing delays), and the right password works once the wait is over', async () => {
    const { email } = await signedUp(limited, 'victim');
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) statuses.push((await from(`198.51.100.${i + 1}`, email, 'wrong password')).status);
    expect(statuses).toEqual([401, 401, 401, 401, 429]); // 3 free failures, then a 1 s wait (1, 2, 4 … s)
    const waiting = await from('198.51.100.99', email, PASSWORD);
    expect(waiting.status).toBe(429); // even the right password waits: the guess is not tested
    const wait = Number(waiting.headers['retry-after']);
    expect(wait).toBeGreaterThanOrEqual(1);
    expect(wait).toBeLessThanOrEqual(2); // the first delay is 1 s (server/services/limits.ts)
    await new Promise((r) => setTimeout(r, wait * 1000 + 100));
    expect((await from('198.51.100.99', email, PASSWORD)).status).toBe(200); // slowed, never locked out
  });

  it('a throttled address does not lock the real user out from another address', async () => {
    const { email: real } = await signedUp(limited, 'real');
    const attacker = '203.0.113.7';
    // The attacker sprays many accounts from one address: one guess each.
    for (let i = 0; i < 6; i++) await from(attacker, uniqueEmail('spray'), 'wrong password');
    const blocked = await from(attacker, uniqueEmail('spray'), 'wrong password');
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toMatch(/address/);
    expect((await from('192.0.2.44', real, PASSWORD)).status).toBe(200);
  });
});

describe('sessions (ASVS 7.2.x, 7.4.x, 7.5.x)', () => {
  it('stores only the SHA-256 of the session id', async () => {
    const email = uniqueEmail('hashed');
    const res = await client(t).post('/api/auth/sign-up', { email, password: PASSWORD, name: 'Hash Check' });
    const cookie = sessionCookie(res)!;
    const id = cookie.split('=')[1];
    const rows = await t.database.db.select({ id: sessions.id }).from(sessions).where(eq(sessions.userId, res.body.user.id));
    expect(rows.map((r) => r.id)).toEqual([sha256(id)]);
  });

  it("lists the user's sessions with when, where and which browser; ends one, or all others", async () => {
    const { c, email } = await signedUp(t, 'sessions');
    const other = request.agent(t.app);
    await other
      .post('/api/auth/sign-in')
      .set('Origin', ORIGIN)
      .set('User-Agent', 'Mozilla/5.0 (X11; Linux x86_64; rv:128.0) Gecko/20100101 Firefox/128.0')
      .send({ email, password: PASSWORD });
    const third = request.agent(t.app);
    await third.post('/api/auth/sign-in').set('Origin', ORIGIN).send({ email, password: PASSWORD });
    const list = await c.get('/api/auth/sessions');
    expect(list.status).toBe(200);
    expect(list.body.sessions).toHaveLength(3);
    const current = list.body.sessions.filter((s: { current: boolean }) => s.current);
    expect(current).toHaveLength(1);
    const firefox = list.body.sessions.find((s: { browser: string }) => s.browser === 'Firefox 128 on Linux');
    expect(firefox).toBeDefined();
    expect(firefox.ip).toMatch(/127\.0\.0\.1/);
    expect(Date.parse(firefox.createdAt)).not.toBeNaN();
    expect(Date.parse(firefox.lastSeenAt)).not.toBeNaN();

    expect((await c.delete(`/api/auth/sessions/${firefox.id}`)).status).toBe(204);
    expect((await other.get('/api/auth/me')).status).toBe(401);
    expect((await third.get('/api/auth/me')).status).toBe(200);
    expect((await c.post('/api/auth/sessions/end-others', {})).body).toEqual({ ended: 1 });
    expect((await third.get('/api/auth/me')).status).toBe(401);
    expect((await c.get('/api/auth/me')).status).toBe(200);
  });

  it("cannot end someone else's session", async () => {
    const a = await signedUp(t, 'owner-a');
    const b = await signedUp(t, 'owner-b');
    const [bSession] = (await b.c.get('/api/auth/sessions')).body.sessions;
    expect((await a.c.delete(`/api/auth/sessions/${bSession.id}`)).status).toBe(404);
    expect((await b.c.get('/api/auth/me')).status).toBe(200);
  });

  it('a site admin ends every session of a user; others cannot', async () => {
    const victim = await signedUp(t, 'ended');
    const admin = client(t);
    expect((await admin.post('/api/auth/sign-in', { email: ADMIN_USER.email, password: ADMIN_USER.password })).status).toBe(200);
    expect((await victim.c.post(`/api/admin/users/${victim.user.id}/end-sessions`, {})).status).toBe(404);
    const found = await admin.get(`/api/admin/users?q=${encodeURIComponent(victim.email)}`);
    expect(found.body.users.map((u: { id: string }) => u.id)).toEqual([victim.user.id]);
    expect((await admin.post(`/api/admin/users/${victim.user.id}/end-sessions`, {})).body).toEqual({ ended: 1 });
    expect((await victim.c.get('/api/auth/me')).status).toBe(401);
  });

  it('the admin list counts only sessions that still work, with the last time one was used', async () => {
    const user = await signedUp(t, 'counted');
    const second = client(t);
    expect((await second.post('/api/auth/sign-in', { email: user.email, password: PASSWORD })).status).toBe(200);
    const admin = client(t);
    expect((await admin.post('/api/auth/sign-in', { email: ADMIN_USER.email, password: ADMIN_USER.password })).status).toBe(200);
    const rows = await t.database.db.select().from(sessions).where(eq(sessions.userId, user.user.id)).orderBy(desc(sessions.createdAt));
    expect(rows).toHaveLength(2);
    // One session ran out yesterday; the other was last used an hour ago.
    const hourAgo = new Date(Date.now() - 3_600_000);
    await t.database.db
      .update(sessions)
      .set({ expiresAt: new Date(Date.now() - 86_400_000) })
      .where(eq(sessions.id, rows[0].id));
    await t.database.db.update(sessions).set({ lastSeenAt: hourAgo }).where(eq(sessions.id, rows[1].id));
    const [listed] = (await admin.get(`/api/admin/users?q=${encodeURIComponent(user.email)}`)).body.users;
    expect(listed).toMatchObject({ email: user.email, sessions: 1, twoFactor: false, emailConfirmed: true });
    expect(Date.parse(listed.lastSeenAt)).toBe(hourAgo.getTime());

    expect((await admin.post(`/api/admin/users/${user.user.id}/end-sessions`, {})).status).toBe(200);
    const [after] = (await admin.get(`/api/admin/users?q=${encodeURIComponent(user.email)}`)).body.users;
    expect(after).toMatchObject({ sessions: 0, lastSeenAt: null });
  });

  it('sign-out tells the browser to clear what it kept (Clear-Site-Data)', async () => {
    const { c } = await signedUp(t, 'clear');
    const res = await c.post('/api/auth/sign-out', {});
    expect(res.status).toBe(204);
    expect(res.headers['clear-site-data']).toBe('"cache", "cookies", "storage"');
  });
});

describe('second factor: TOTP (RFC 6238) and recovery codes (ASVS 6.5.x, 6.6.x)', () => {
  async function withTwoFactor(prefix: string) {
    const account = await signedUp(t, prefix);
    expect((await account.c.post('/api/auth/two-factor/setup', { password: 'wrong password' })).status).toBe(400); // the password again first
    const setup = await account.c.post('/api/auth/two-factor/setup', { password: PASSWORD });
    expect(setup.status).toBe(200);
    expect(setup.body.uri).toMatch(/^otpauth:\/\/totp\/Spoolbook:/);
    expect(setup.body.qrCode).toMatch(/^data:image\/png;base64,/);
    const secret = setup.body.secret as string;
    expect((await account.c.post('/api/auth/two-factor/enable', { code: '000000' })).status).toBe(400);
    const on = await account.c.post('/api/auth/two-factor/enable', { code: await generate({ secret }) });
    expect(on.status).toBe(200);
    expect(on.body.recoveryCodes).toHaveLength(10);
    return { ...account, secret, recoveryCodes: on.body.recoveryCodes as string[] };
  }

  it('the password alone gives no session; a code does, once', async () => {
    const { email, secret } = await withTwoFactor('totp');
    const c = client(t);
    const first = await c.post('/api/auth/sign-in', { email, password: PASSWORD });
    expect(first.status).toBe(200);
    expect(first.body.secondFactor).toBe(true);
    expect(sessionCookie(first)).toBeUndefined();
    expect((await c.get('/api/auth/me')).status).toBe(401);
    const wrong = await c.post('/api/auth/sign-in/second-factor', { challenge: first.body.challenge, code: '123456' });
    expect(wrong.status).toBe(401);
    // The code for the next 30 s step: the one used when turning it on is spent already.
    const code = await generate({ secret, epoch: Math.floor(Date.now() / 1000) + 30 });
    const ok = await c.post('/api/auth/sign-in/second-factor', { challenge: first.body.challenge, code });
    expect(ok.status).toBe(200);
    expect(ok.body.user.twoFactor).toBe(true);
    expect((await c.get('/api/auth/me')).status).toBe(200);
    // Replaying the same code (or the spent challenge) is refused.
    const again = await client(t).post('/api/auth/sign-in', { email, password: PASSWORD });
    expect((await client(t).post('/api/auth/sign-in/second-factor', { challenge: again.body.challenge, code })).status).toBe(401);
    expect((await client(t).post('/api/auth/sign-in/second-factor', { challenge: first.body.challenge, code })).status).toBe(401);
  });

  it('a recovery code works once', async () => {
    const { email, recoveryCodes } = await withTwoFactor('recovery');
    const one = await client(t).post('/api/auth/sign-in', { email, password: PASSWORD });
    expect((await client(t).post('/api/auth/sign-in/second-factor', { challenge: one.body.challenge, code: recoveryCodes[0] })).status).toBe(200);
    const two = await client(t).post('/api/auth/sign-in', { email, password: PASSWORD });
    expect((await client(t).post('/api/auth/sign-in/second-factor', { challenge: two.body.challenge, code: recoveryCodes[0] })).status).toBe(401);
  });

  it('a challenge allows five codes, then the password must be given again', async () => {
    const { email } = await withTwoFactor('challenge');
    const c = client(t);
    const { body } = await c.post('/api/auth/sign-in', { email, password: PASSWORD });
    const statuses: string[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await c.post('/api/auth/sign-in/second-factor', { challenge: body.challenge, code: '111111' })).body.error.code);
    expect(statuses).toEqual(['invalid_code', 'invalid_code', 'invalid_code', 'invalid_code', 'invalid_code', 'challenge_expired']);
  });

  it('a team that requires it keeps out members without it', async () => {
    const owner = await withTwoFactor('tf-owner');
    const member = await signedUp(t, 'tf-member');
    const team = await owner.c.post('/api/teams', { name: 'Second factor team' });
    const teamId = team.body.team.id as string;
    await owner.c.post(`/api/teams/${teamId}/invitations`, { email: member.email, role: 'editor' });
    const token = (await latestLinkTo(t, member.email, '/invitations/')).split('/invitations/')[1];
    expect((await member.c.post(`/api/invitations/${token}/accept`, {})).status).toBe(200);
    expect((await member.c.get(`/api/teams/${teamId}/studies`)).status).toBe(200);

    // An owner without a second factor may not set the rule (they would lock themselves out).
    const plainOwner = await signedUp(t, 'tf-plain');
    const plainTeam = await plainOwner.c.post('/api/teams', { name: 'No factor' });
    expect((await plainOwner.c.put(`/api/teams/${plainTeam.body.team.id}/two-factor`, { required: true })).status).toBe(400);

    expect((await owner.c.put(`/api/teams/${teamId}/two-factor`, { required: true })).status).toBe(200);
    const refused = await member.c.get(`/api/teams/${teamId}/studies`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('two_factor_required');
    // The message says where to turn it on, by the names the screens use.
    expect(refused.body.error.message).toContain('Account → Second factor');
    expect((await owner.c.get(`/api/teams/${teamId}/studies`)).status).toBe(200);
    // The team page itself is closed too; `me` says which teams ask, so the client can say why.
    expect((await member.c.get(`/api/teams/${teamId}`)).body.error.code).toBe('two_factor_required');
    const asking = (await member.c.get('/api/auth/me')).body.teams.find((team: { id: string }) => team.id === teamId);
    expect(asking.requireTwoFactor).toBe(true);
  });
});

describe('sign-up confirms the address (ASVS 6.4.x)', () => {
  it('an unconfirmed account works in its personal team but cannot create teams or invite; the mailed link confirms it once', async () => {
    const { c, email, personalTeamId } = await signedUp(t, 'unconfirmed', { confirmed: false });
    expect((await c.get('/api/auth/me')).body.user.emailConfirmed).toBe(false);
    expect((await c.get(`/api/teams/${personalTeamId}/studies`)).status).toBe(200);
    const create = await c.post('/api/teams', { name: 'Too soon' });
    expect(create.status).toBe(403);
    expect(create.body.error.code).toBe('email_unconfirmed');
    expect((await c.post(`/api/teams/${personalTeamId}/invitations`, { email: uniqueEmail('x'), role: 'viewer' })).status).toBe(403);

    const link = linkIn((await latestMailTo(t, email)).text, '/confirm-email?token=');
    const confirm = await client(t).post('/api/auth/confirm-email', { token: tokenOf(link) });
    expect(confirm.status).toBe(200);
    expect((await client(t).post('/api/auth/confirm-email', { token: tokenOf(link) })).status).toBe(400);
    expect((await c.get('/api/auth/me')).body.user.emailConfirmed).toBe(true);
    expect((await c.post('/api/teams', { name: 'Now it works' })).status).toBe(201);
  });

  it('joining by an invitation mailed to that address confirms it too', async () => {
    const owner = await signedUp(t, 'inviter');
    const team = await owner.c.post('/api/teams', { name: 'Join to confirm' });
    const invitee = await signedUp(t, 'invitee', { confirmed: false });
    await owner.c.post(`/api/teams/${team.body.team.id}/invitations`, { email: invitee.email, role: 'viewer' });
    const token = (await latestLinkTo(t, invitee.email, '/invitations/')).split('/invitations/')[1];
    expect((await invitee.c.post(`/api/invitations/${token}/accept`, {})).status).toBe(200);
    expect((await invitee.c.get('/api/auth/me')).body.user.emailConfirmed).toBe(true);
  });
});

describe('no known passwords outside development; a masked outbox (ASVS 13.3.x, 16.2.x)', () => {
  it('the outbox view hides tokens unless the server runs in development with the local mail catcher', async () => {
    const { email } = await signedUp(t, 'masked');
    await client(t).post('/api/auth/password-reset', { email });
    const stored = await latestMailTo(t, email);
    const token = tokenOf(linkIn(stored.text, '/reset-password?token='));
    const admin = client(t);
    await admin.post('/api/auth/sign-in', { email: ADMIN_USER.email, password: ADMIN_USER.password });
    const shown = await admin.get(`/api/admin/outbox/${stored.id}`);
    expect(shown.status).toBe(200);
    expect(shown.body.message.text).not.toContain(token);
    expect(shown.body.message.text).toContain('/reset-password?token=[hidden]');
    expect(shown.body.tokensHidden).toBe(true);

    const dev = await startTestApp({ development: true, smtpUrl: null });
    try {
      const devAdmin = client(dev);
      await devAdmin.post('/api/auth/sign-in', { email: ADMIN_USER.email, password: ADMIN_USER.password });
      expect((await devAdmin.get(`/api/admin/outbox/${stored.id}`)).body.message.text).toContain(token);
    } finally {
      await dev.close();
    }
    const withRelay = await startTestApp({ development: true, smtpUrl: 'smtp://relay.invalid:25' });
    try {
      const relayAdmin = client(withRelay);
      await relayAdmin.post('/api/auth/sign-in', { email: ADMIN_USER.email, password: ADMIN_USER.password });
      expect((await relayAdmin.get(`/api/admin/outbox/${stored.id}`)).body.message.text).not.toContain(token);
    } finally {
      await withRelay.close();
    }
  });

  it('development mode refuses to serve beyond loopback', () => {
    const env = { DATABASE_URL: 'postgres://x@127.0.0.1/x', NODE_ENV: 'development', HOST: '0.0.0.0' };
    expect(() => loadConfig(env)).toThrow(/loopback/);
    expect(loadConfig({ ...env, HOST: '127.0.0.1' }).development).toBe(true);
    expect(loadConfig({ DATABASE_URL: env.DATABASE_URL }).development).toBe(false); // the default is production
  });
});

describe('headers (ASVS 3.4.x)', () => {
  it('CSP forbids <base> and framing', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("base-uri 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
  });
});

describe('after the tests of this file', () => {
  it('left no session id in the clear in the table', async () => {
    const rows = await t.database.db.select({ id: sessions.id }).from(sessions).orderBy(desc(sessions.createdAt)).limit(50);
    for (const r of rows) expect(r.id).toMatch(/^[0-9a-f]{64}$/);
  });
});

void confirmAddress;
void expectErrorShape;
