import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessions, users } from '#server/db/schema';
import {
  client,
  expectErrorShape,
  latestLinkTo,
  latestMailTo,
  linkIn,
  ORIGIN,
  PASSWORD,
  signedUp,
  startTestApp,
  tokenOf,
  uniqueEmail,
  type TestApp,
} from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('sign-up', () => {
  it('creates the account, a personal team, and a session', async () => {
    const c = client(t);
    const email = uniqueEmail('signup');
    const res = await c.post('/api/auth/sign-up', { email: email.toUpperCase(), password: PASSWORD, name: 'Alex Example' });
    expect(res.status).toBe(201);
    expect(res.body.user.email).toBe(email); // stored lower-cased
    expect(res.body.teams).toHaveLength(1);
    expect(res.body.teams[0]).toMatchObject({ personal: true, role: 'owner' });
    const cookie = res.headers['set-cookie'][0] as string;
    // OWASP ASVS 5.0 3.3.1–3.3.4: HttpOnly and SameSite on the session cookie (Secure is added over https).
    expect(cookie).toMatch(/^spoolbook_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.name).toBe('Alex Example');
  });

  it('stores an argon2id hash with the OWASP parameters, never the password', async () => {
    const { email } = await signedUp(t, 'hash');
    const [row] = await t.database.db.select().from(users).where(eq(users.email, email));
    // OWASP Password Storage Cheat Sheet / ASVS 5.0 11.4.2: argon2id, m=19456 KiB, t=2, p=1.
    expect(row.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(row.passwordHash).not.toContain(PASSWORD);
  });

  it('refuses a taken e-mail with 409 naming the field', async () => {
    const { email } = await signedUp(t, 'taken');
    const res = await client(t).post('/api/auth/sign-up', { email, password: PASSWORD, name: 'Again' });
    expect(res.status).toBe(409);
    expect(res.body.error.details.issues[0].path).toBe('email');
  });

  it('refuses a short password and a bad e-mail, naming each field', async () => {
    const res = await client(t).post('/api/auth/sign-up', { email: 'not-an-email', password: 'short', name: 'X' });
    expect(res.status).toBe(400);
    const paths = res.body.error.details.issues.map((i: { path: string }) => i.path).sort();
    expect(paths).toEqual(['email', 'password']);
  });
});

describe('sign-in and sign-out', () => {
  it('signs in with the right password and issues a new session id each time (ASVS 5.0 7.2.4)', async () => {
    const { email } = await signedUp(t, 'signin');
    const c = client(t);
    const a = await c.post('/api/auth/sign-in', { email, password: PASSWORD });
    expect(a.status).toBe(200);
    const first = (a.headers['set-cookie'] as unknown as string[]).find((s) => s.startsWith('spoolbook_session='))!;
    const b = await c.post('/api/auth/sign-in', { email, password: PASSWORD });
    const second = (b.headers['set-cookie'] as unknown as string[]).find((s) => s.startsWith('spoolbook_session=') && !s.startsWith('spoolbook_session=;'))!;
    expect(second.split(';')[0]).not.toBe(first.split(';')[0]);
  });

  it('answers a wrong password and an unknown e-mail the same way', async () => {
    const { email } = await signedUp(t, 'wrongpw');
    const wrong = await client(t).post('/api/auth/sign-in', { email, password: 'not the password' });
    const unknown = await client(t).post('/api/auth/sign-in', { email: uniqueEmail('nobody'), password: 'not the password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expectErrorShape(wrong.body);
  });

  it('signs out: the session ends on the server and the cookie is cleared', async () => {
    const { c, user } = await signedUp(t, 'signout');
    const out = await c.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect(await c.get('/api/auth/me').then((r) => r.status)).toBe(401);
    const left = await t.database.db.select().from(sessions).where(eq(sessions.userId, user.id));
    expect(left).toHaveLength(0);
  });

  it('slows failed sign-ins down with 429 and Retry-After (OWASP ASVS 5.0 6.3.1)', async () => {
    const limited = await startTestApp({ authRateLimit: 3 });
    try {
      const c = client(limited);
      const email = uniqueEmail('ratelimit');
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++) statuses.push((await c.post('/api/auth/sign-in', { email, password: 'wrong password' })).status);
      // 3 free failures set in this test's config; the 4th starts a delay, so the 5th must wait.
      expect(statuses).toEqual([401, 401, 401, 401, 429]);
      const res = await c.post('/api/auth/sign-in', { email, password: 'wrong password' });
      expect(res.headers['retry-after']).toBeDefined();
      expectErrorShape(res.body);
    } finally {
      await limited.close();
    }
  });

  it('ends a session past its absolute lifetime even while it is being used', async () => {
    const short = await startTestApp({ sessionAbsoluteMs: 1500 });
    try {
      const { c } = await signedUp(short, 'absolute');
      expect((await c.get('/api/auth/me')).status).toBe(200);
      await new Promise((r) => setTimeout(r, 1700));
      expect((await c.get('/api/auth/me')).status).toBe(401);
    } finally {
      await short.close();
    }
  });
});

describe('profile', () => {
  it('remembers the unit system per user', async () => {
    const { c } = await signedUp(t, 'units');
    const res = await c.patch('/api/auth/me', { unitSystem: 'us' });
    expect(res.status).toBe(200);
    expect((await c.get('/api/auth/me')).body.user.unitSystem).toBe('us');
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
