import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { outbox, passwordResets, users } from '#server/db/schema';
import type { MailMessage, Mailer } from '#server/mail/mailer';
import { client, latestLinkTo, latestMailTo, linkIn, ORIGIN, PASSWORD, signedUp, startTestApp, tokenOf, uniqueEmail, type TestApp } from './helpers';

// Passwords: reset links, changing one, the strength rule (server/services/passwords.ts and the
// password routes of server/routes/auth.ts). OWASP ASVS 5.0 ids are named beside the checks.

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('password reset through the e-mailed link', () => {
  it('resets the password, ends every session, and the link works once', async () => {
    const { c, email } = await signedUp(t, 'reset');
    const ask = await client(t).post('/api/auth/password-reset', { email });
    expect(ask.status).toBe(202);
    const mail = await latestMailTo(t, email, '/reset-password?token=');
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
    const token = tokenOf(await latestLinkTo(t, email, '/reset-password?token='));
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
    const token = tokenOf(await latestLinkTo(t, email, '/reset-password?token='));
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
});

describe('reset links (ASVS 6.3.x, 6.4.x)', () => {
  it('only the newest link works; using it ends every link', async () => {
    const { email } = await signedUp(t, 'reset-one');
    await client(t).post('/api/auth/password-reset', { email });
    const first = tokenOf(await latestLinkTo(t, email, '/reset-password?token='));
    await client(t).post('/api/auth/password-reset', { email });
    const second = tokenOf(await latestLinkTo(t, email, '/reset-password?token='));
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
    const token = tokenOf(await latestLinkTo(t, email, '/reset-password?token='));
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
    const token = tokenOf(await latestLinkTo(t, email, '/reset-password?token='));
    const reset = await client(t).post('/api/auth/password-reset/confirm', { token, password: '123456789' });
    expect(reset.status).toBe(400);
    // A refused password does not use the link up.
    expect((await client(t).post('/api/auth/password-reset/confirm', { token, password: 'a brand new password' })).status).toBe(204);
  });
});
