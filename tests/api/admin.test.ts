import { desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '#server/config';
import { sessions } from '#server/db/schema';
import { ADMIN_USER } from '#server/services/demo';
import { adminClient, client, latestMailTo, linkIn, PASSWORD, signedUp, startTestApp, tokenOf, type Client, type TestApp } from './helpers';

// The site admin's pages (server/routes/admin.ts: server/services/admins.ts, outbox.ts).

let t: TestApp;
let admin: Client;
beforeAll(async () => {
  t = await startTestApp();
  admin = await adminClient(t);
});
afterAll(async () => {
  await t.close();
});

describe('site admin', () => {
  it('sees every team and the outbox; others get 404 there', async () => {
    const someone = await signedUp(t, 'plain');
    const teams = await admin.get('/api/teams');
    expect(teams.body.teams.some((tm: { id: string }) => tm.id === someone.personalTeamId)).toBe(true);
    const box = await admin.get('/api/admin/outbox');
    expect(box.status).toBe(200);
    expect((await someone.c.get('/api/admin/outbox')).status).toBe(404);
  });
});

describe('users and their sessions', () => {
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
});

describe('no known passwords outside development; a masked outbox (ASVS 13.3.x, 16.2.x)', () => {
  it('the outbox view hides tokens unless the server runs in development with the local mail catcher', async () => {
    const { email } = await signedUp(t, 'masked');
    await client(t).post('/api/auth/password-reset', { email });
    const stored = await latestMailTo(t, email, '/reset-password?token=');
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
