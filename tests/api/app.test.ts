import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, expectErrorShape, ORIGIN, signedUp, startTestApp, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('health', () => {
  it('reports server and database up', async () => {
    const res = await client(t).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'ok', server: 'up', database: 'up' });
  });
});

describe('bad input never gets a 500', () => {
  it('malformed JSON answers 400 with the error shape', async () => {
    const { c } = await signedUp(t, 'malformed');
    const res = await c.agent.post('/api/teams').set('Origin', ORIGIN).set('Content-Type', 'application/json').send('{"name": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
  });

  it('an oversized body answers 413', async () => {
    const { c } = await signedUp(t, 'oversized');
    // The JSON body limit is 1 MB (server/app.ts).
    const res = await c.agent
      .post('/api/teams')
      .set('Origin', ORIGIN)
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ name: 'x'.repeat(1_100_000) }));
    expect(res.status).toBe(413);
    expectErrorShape(res.body);
  });

  it('missing fields and wrong types name their paths', async () => {
    const res = await client(t).post('/api/auth/sign-up', { email: 42 });
    expect(res.status).toBe(400);
    const paths = res.body.error.details.issues.map((i: { path: string }) => i.path).sort();
    expect(paths).toEqual(['email', 'name', 'password']);
  });

  it('an unknown key is refused by name (no mass assignment)', async () => {
    const { c } = await signedUp(t, 'massassign');
    const res = await c.patch('/api/auth/me', { isAdmin: true });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error.details)).toContain('isAdmin');
    expect((await c.get('/api/auth/me')).body.user.isAdmin).toBe(false);
  });

  it('a body that is not an object is refused', async () => {
    const res = await client(t).agent.post('/api/auth/sign-in').set('Origin', ORIGIN).set('Content-Type', 'application/json').send('[1,2,3]');
    expect(res.status).toBe(400);
    expectErrorShape(res.body);
  });

  it('an unknown API route answers 404 with the error shape', async () => {
    const res = await client(t).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expectErrorShape(res.body);
  });

  it('errors carry no stack trace (ASVS 5.0 16.5)', async () => {
    const res = await client(t).post('/api/auth/sign-in', { email: 'x@y.z', password: 1 });
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/);
  });

  it('sets security headers (helmet)', async () => {
    const res = await client(t).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
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

describe('headers (ASVS 3.4.x)', () => {
  it('CSP forbids <base> and framing', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("base-uri 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
  });
});
