import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, teamMembers } from '#server/db/schema';
import { ADMIN_USER } from '#server/services/demo';
import { client, latestMailTo, linkIn, PASSWORD, signedUp, startTestApp, uniqueEmail, type TestApp } from './helpers';

const demo = JSON.parse(readFileSync(path.resolve(import.meta.dirname, '..', '..', 'data', 'demo', 'hillclimb-study.json'), 'utf8'));

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('audit record (OWASP ASVS 5.0 16.2–16.4)', () => {
  it('records the team events with who, what and when in UTC, and owners read them', async () => {
    const owner = await signedUp(t, 'audited');
    const teamId = (await owner.c.post('/api/teams', { name: 'Audited team' })).body.team.id;
    const inviteeEmail = uniqueEmail('invitee');
    const inv = await owner.c.post(`/api/teams/${teamId}/invitations`, { email: inviteeEmail, role: 'viewer' });
    const token = linkIn((await latestMailTo(t, inviteeEmail)).text, '/invitations/').split('/invitations/')[1];
    const invitee = client(t);
    await invitee.post('/api/auth/sign-up', { email: inviteeEmail, password: PASSWORD, name: 'Invitee' });
    await invitee.post(`/api/invitations/${token}/accept`);
    const inviteeId = (await invitee.get('/api/auth/me')).body.user.id;
    await owner.c.patch(`/api/teams/${teamId}/members/${inviteeId}`, { role: 'editor' });
    const study = (await owner.c.post(`/api/teams/${teamId}/studies`, { title: 'Audited study', document: demo })).body.study;
    const link = (await owner.c.post(`/api/teams/${teamId}/studies/${study.id}/share-links`, {})).body.shareLink;
    await owner.c.delete(`/api/teams/${teamId}/studies/${study.id}/share-links/${link.id}`);
    await owner.c.delete(`/api/teams/${teamId}/studies/${study.id}`);
    await owner.c.delete(`/api/teams/${teamId}/members/${inviteeId}`);

    const res = await owner.c.get(`/api/teams/${teamId}/audit`);
    expect(res.status).toBe(200);
    const actions = (res.body.events as { action: string }[]).map((e) => e.action).reverse();
    expect(actions).toEqual([
      'team.created',
      'invitation.created',
      'invitation.accepted',
      'member.role-changed',
      'share-link.created',
      'share-link.revoked',
      'study.deleted',
      'member.removed',
    ]);
    const event = res.body.events.find((e: { action: string }) => e.action === 'member.role-changed');
    expect(event).toMatchObject({ actorEmail: owner.email, targetId: inviteeId, details: { role: 'editor' } });
    expect(event.at).toMatch(/Z$/); // UTC
    // No secrets: neither the invitation token, the share URL's token nor any password.
    const text = JSON.stringify(res.body);
    expect(text).not.toContain(token);
    expect(text).not.toContain(link.url.split('/share/')[1]);
    expect(text).not.toContain(PASSWORD);
    expect(inv.status).toBe(201);
  });

  it('records sign-ins and failed sign-ins without the password tried', async () => {
    const { email } = await signedUp(t, 'signins');
    await client(t).post('/api/auth/sign-in', { email, password: 'the wrong one, typed by mistake' });
    await client(t).post('/api/auth/sign-in', { email, password: PASSWORD });
    const rows = await t.database.db.select().from(auditEvents);
    const mine = rows.filter((r) => r.actorEmail === email).map((r) => r.action);
    expect(mine).toEqual(expect.arrayContaining(['auth.sign-up', 'auth.sign-in-failed', 'auth.sign-in']));
    expect(JSON.stringify(rows)).not.toContain('the wrong one, typed by mistake');
    const admin = client(t);
    await admin.post('/api/auth/sign-in', { email: ADMIN_USER.email, password: ADMIN_USER.password });
    const all = await admin.get('/api/admin/audit?limit=500');
    expect(all.status).toBe(200);
    expect(all.body.events.some((e: { action: string; actorEmail: string }) => e.action === 'auth.sign-in-failed' && e.actorEmail === email)).toBe(true);
  });

  it('only owners read their team record: editors 403, outsiders 404, bad queries 400', async () => {
    const owner = await signedUp(t, 'auditowner');
    const teamId = (await owner.c.post('/api/teams', { name: 'Private record' })).body.team.id;
    const editor = await signedUp(t, 'auditeditor');
    await t.database.db.insert(teamMembers).values({ teamId, userId: editor.user.id, role: 'editor' });
    expect((await editor.c.get(`/api/teams/${teamId}/audit`)).status).toBe(403);
    expect((await (await signedUp(t, 'auditstranger')).c.get(`/api/teams/${teamId}/audit`)).status).toBe(404);
    expect((await owner.c.get(`/api/teams/${teamId}/audit?before=yesterday`)).status).toBe(400);
    expect((await owner.c.get(`/api/admin/audit`)).status).toBe(404);
  });
});
