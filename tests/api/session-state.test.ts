import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USER } from '#server/services/demo';
import { client, expectErrorShape, signedUp, startTestApp, type TestApp } from './helpers';

let t: TestApp;
let dev: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  dev = await startTestApp({ development: true });
});
afterAll(async () => {
  await t.close();
  await dev.close();
});

describe('GET /api/auth/session', () => {
  it('answers 200 signed out (no 401 for a visitor’s page to log), with no demo sign-in outside development', async () => {
    const res = await client(t).get('/api/auth/session');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ me: null, demo: false });
  });

  it('answers who is signed in, as /api/auth/me does', async () => {
    const someone = await signedUp(t, 'session-state');
    const [state, me] = await Promise.all([someone.c.get('/api/auth/session'), someone.c.get('/api/auth/me')]);
    expect(state.status).toBe(200);
    expect(state.body.me).toEqual(me.body);
  });
});

describe('POST /api/auth/demo-sign-in', () => {
  it('does not exist outside development', async () => {
    const res = await client(t).post('/api/auth/demo-sign-in', {});
    expect(res.status).toBe(404);
    expectErrorShape(res.body);
    expect((await client(t).get('/api/auth/session')).body.demo).toBe(false);
  });

  it('signs a visitor of a development server into the demo account in one request', async () => {
    const visitor = client(dev);
    expect((await visitor.get('/api/auth/session')).body).toEqual({ me: null, demo: true });
    const res = await visitor.post('/api/auth/demo-sign-in', {});
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(DEMO_USER.email);
    const state = await visitor.get('/api/auth/session');
    expect(state.body.me.user.email).toBe(DEMO_USER.email);
  });
});
