import { generate } from 'otplib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, latestLinkTo, PASSWORD, sessionCookie, signedUp, startTestApp, type TestApp } from './helpers';

// The second factor: TOTP and recovery codes (server/services/two-factor.ts), and a team's rule
// that asks for it. OWASP ASVS 5.0 ids are named beside the checks.

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
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
