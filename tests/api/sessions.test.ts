import { createHash } from 'node:crypto';
import { desc, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessions } from '#server/db/schema';
import { client, ORIGIN, PASSWORD, sessionCookie, signedUp, startTestApp, uniqueEmail, type TestApp } from './helpers';

// Sessions: stored hashed, listed and ended by their user (server/auth/session.ts,
// server/services/sessions.ts). OWASP ASVS 5.0 ids are named beside the checks.

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

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

  it('sign-out tells the browser to clear what it kept (Clear-Site-Data)', async () => {
    const { c } = await signedUp(t, 'clear');
    const res = await c.post('/api/auth/sign-out', {});
    expect(res.status).toBe(204);
    expect(res.headers['clear-site-data']).toBe('"cache", "cookies", "storage"');
  });
});

describe('after the tests of this file', () => {
  it('left no session id in the clear in the table', async () => {
    const rows = await t.database.db.select({ id: sessions.id }).from(sessions).orderBy(desc(sessions.createdAt)).limit(50);
    for (const r of rows) expect(r.id).toMatch(/^[0-9a-f]{64}$/);
  });
});
