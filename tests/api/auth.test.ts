import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { passwordResets, sessions, users } from '#server/db/schema';
import { client, expectErrorShape, latestMailTo, linkIn, PASSWORD, signedUp, startTestApp, uniqueEmail, type TestApp } from './helpers';

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

describe('password reset through the e-mailed link', () => {
  it('resets the password, ends every session, and the link works once', async () => {
    const { c, email } = await signedUp(t, 'reset');
    const ask = await client(t).post('/api/auth/password-reset', { email });
    expect(ask.status).toBe(202);
    const mail = await latestMailTo(t, email);
    expect(mail.subject).toMatch(/reset/i);
    const link = linkIn(mail.text, '/reset-password?token=');
    const token = new URL(link).searchParams.get('token')!;

    const done = await client(t).post('/api/auth/password-reset/confirm', { token, password: 'a brand new password' });
    expect(done.status).toBe(204);
    expect((await c.get('/api/auth/me')).status).toBe(401); // the old session ended
    expect((await client(t).post('/api/auth/sign-in', { email, password: PASSWORD })).status).toBe(401);
    expect((await client(t).post('/api/auth/sign-in', { email, password: 'a brand new password' })).status).toBe(200);

    const again = await client(t).post('/api/auth/password-reset/confirm', { token, password: 'yet another password' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
  });

  it('answers an unknown e-mail exactly like a known one and sends nothing', async () => {
    const nobody = uniqueEmail('nobody');
    const res = await client(t).post('/api/auth/password-reset', { email: nobody });
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ ok: true });
    await expect(latestMailTo(t, nobody)).rejects.toThrow(/no mail/);
  });

  it('refuses an expired token', async () => {
    const { email, user } = await signedUp(t, 'expired');
    await client(t).post('/api/auth/password-reset', { email });
    const token = new URL(linkIn((await latestMailTo(t, email)).text, '/reset-password?token=')).searchParams.get('token')!;
    await t.database.db
      .update(passwordResets)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(passwordResets.userId, user.id));
    const res = await client(t).post('/api/auth/password-reset/confirm', { token, password: 'a brand new password' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_token');
  });

  it('stores only a hash of the token', async () => {
    const { email, user } = await signedUp(t, 'hashed');
    await client(t).post('/api/auth/password-reset', { email });
    const token = new URL(linkIn((await latestMailTo(t, email)).text, '/reset-password?token=')).searchParams.get('token')!;
    const rows = await t.database.db.select().from(passwordResets).where(eq(passwordResets.userId, user.id));
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).not.toBe(token);
    expect(rows[0].tokenHash).toMatch(/^[0-9a-f]{64}$/); // SHA-256 hex
  });
});

describe('password change', () => {
  it('needs the current password and ends the other sessions', async () => {
    const { c, email } = await signedUp(t, 'change');
    const other = client(t);
    await other.post('/api/auth/sign-in', { email, password: PASSWORD });
    const bad = await c.post('/api/auth/password', { currentPassword: 'wrong', newPassword: 'another long password' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.issues[0].path).toBe('currentPassword');
    const ok = await c.post('/api/auth/password', { currentPassword: PASSWORD, newPassword: 'another long password' });
    expect(ok.status).toBe(200);
    expect((await c.get('/api/auth/me')).status).toBe(200);
    expect((await other.get('/api/auth/me')).status).toBe(401);
  });

  it('remembers the unit system per user', async () => {
    const { c } = await signedUp(t, 'units');
    const res = await c.patch('/api/auth/me', { unitSystem: 'us' });
    expect(res.status).toBe(200);
    expect((await c.get('/api/auth/me')).body.user.unitSystem).toBe('us');
  });
});

describe('origin check (ASVS 5.0 3.5.1–3.5.3)', () => {
  it('refuses a state-changing request from another origin', async () => {
    const { c } = await signedUp(t, 'origin');
    const res = await c.agent.post('/api/teams').set('Origin', 'https://evil.example').send({ name: 'Nope' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('bad_origin');
  });

  it('refuses a signed-in state change that carries neither Origin nor Sec-Fetch-Site', async () => {
    const { c } = await signedUp(t, 'noorigin');
    const res = await c.agent.post('/api/teams').send({ name: 'Nope' });
    expect(res.status).toBe(403);
  });

  it('accepts Sec-Fetch-Site: same-origin', async () => {
    const { c } = await signedUp(t, 'fetchsite');
    const res = await c.agent.post('/api/teams').set('Sec-Fetch-Site', 'same-origin').send({ name: 'Same origin team' });
    expect(res.status).toBe(201);
  });
});
