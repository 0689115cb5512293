import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { outbox } from '#server/db/schema';
import { client, latestLinkTo, PASSWORD, signedUp, startTestApp, uniqueEmail, type TestApp } from './helpers';

// Invitations: sent, resent, cancelled by owners, read and accepted by the invitee
// (server/services/invitations.ts).

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('invitations', () => {
  it('invite, read the link from the outbox, sign up as the invitee and join with the role', async () => {
    const owner = await signedUp(t, 'inviter');
    const teamId = (await owner.c.post('/api/teams', { name: 'Invite team' })).body.team.id;
    const email = uniqueEmail('invitee');
    const inv = await owner.c.post(`/api/teams/${teamId}/invitations`, { email, role: 'editor' });
    expect(inv.status).toBe(201);
    const link = await latestLinkTo(t, email, '/invitations/');
    const token = link.split('/invitations/')[1];

    const preview = await client(t).get(`/api/invitations/${token}`);
    expect(preview.body).toMatchObject({ teamName: 'Invite team', role: 'editor', email });

    const invitee = client(t);
    await invitee.post('/api/auth/sign-up', { email, password: PASSWORD, name: 'New Person' });
    const accepted = await invitee.post(`/api/invitations/${token}/accept`);
    expect(accepted.status).toBe(200);
    expect(accepted.body.team).toMatchObject({ id: teamId, role: 'editor' });
    expect((await invitee.post(`/api/invitations/${token}/accept`)).status).toBe(404); // single use
    expect((await owner.c.get(`/api/teams/${teamId}`)).body.invitations).toHaveLength(0);
  });

  it('refuses an invitation accepted from another account', async () => {
    const owner = await signedUp(t, 'inviter2');
    const teamId = (await owner.c.post('/api/teams', { name: 'Invite team 2' })).body.team.id;
    const email = uniqueEmail('invited');
    await owner.c.post(`/api/teams/${teamId}/invitations`, { email, role: 'viewer' });
    const token = (await latestLinkTo(t, email, '/invitations/')).split('/invitations/')[1];
    const stranger = await signedUp(t, 'stranger');
    const res = await stranger.c.post(`/api/invitations/${token}/accept`);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('wrong_account');
  });

  it('resend replaces the link; cancel makes it invalid', async () => {
    const owner = await signedUp(t, 'resender');
    const teamId = (await owner.c.post('/api/teams', { name: 'Resend team' })).body.team.id;
    const email = uniqueEmail('resent');
    const inv = await owner.c.post(`/api/teams/${teamId}/invitations`, { email, role: 'viewer' });
    const firstToken = (await latestLinkTo(t, email, '/invitations/')).split('/invitations/')[1];
    await new Promise((r) => setTimeout(r, 5));
    const resent = await owner.c.post(`/api/teams/${teamId}/invitations/${inv.body.invitation.id}/resend`);
    expect(resent.status).toBe(200);
    const secondToken = (await latestLinkTo(t, email, '/invitations/')).split('/invitations/')[1];
    expect(secondToken).not.toBe(firstToken);
    expect((await client(t).get(`/api/invitations/${firstToken}`)).status).toBe(404);
    expect((await client(t).get(`/api/invitations/${secondToken}`)).status).toBe(200);
    expect((await owner.c.delete(`/api/teams/${teamId}/invitations/${inv.body.invitation.id}`)).status).toBe(204);
    expect((await client(t).get(`/api/invitations/${secondToken}`)).status).toBe(404);
  });

  it('refuses inviting someone who is already a member', async () => {
    const owner = await signedUp(t, 'dupe');
    const teamId = (await owner.c.post('/api/teams', { name: 'Dupe team' })).body.team.id;
    const res = await owner.c.post(`/api/teams/${teamId}/invitations`, { email: owner.email, role: 'viewer' });
    expect(res.status).toBe(409);
    expect(res.body.error.details.issues[0].path).toBe('email');
  });
});

describe('invitations: limited per team and per user, plain-text mail', () => {
  it('the 4th invitation of a team within the hour is refused with 429', async () => {
    const limited = await startTestApp({}, { invitationsPerTeam: 3, invitationsPerUser: 100 });
    try {
      const owner = await signedUp(limited, 'inviter');
      const teamId = (await owner.c.post('/api/teams', { name: 'Spam team' })).body.team.id;
      const statuses: number[] = [];
      for (let i = 0; i < 4; i++)
        statuses.push((await owner.c.post(`/api/teams/${teamId}/invitations`, { email: uniqueEmail('target'), role: 'viewer' })).status);
      expect(statuses).toEqual([201, 201, 201, 429]); // 3 per team per hour in this test's settings
    } finally {
      await limited.close();
    }
  });

  it('resends count too, per user over all their teams, and per invited address', async () => {
    const limited = await startTestApp({}, { invitationsPerTeam: 100, invitationsPerUser: 100, invitationsPerAddress: 2 });
    try {
      const owner = await signedUp(limited, 'resender');
      const teamId = (await owner.c.post('/api/teams', { name: 'Resend team' })).body.team.id;
      const target = uniqueEmail('bombed');
      const made = await owner.c.post(`/api/teams/${teamId}/invitations`, { email: target, role: 'viewer' });
      expect((await owner.c.post(`/api/teams/${teamId}/invitations/${made.body.invitation.id}/resend`, {})).status).toBe(200);
      const third = await owner.c.post(`/api/teams/${teamId}/invitations/${made.body.invitation.id}/resend`, {});
      expect(third.status).toBe(429); // 2 mails per invited address per hour in this test's settings
    } finally {
      await limited.close();
    }
    const perUser = await startTestApp({}, { invitationsPerTeam: 100, invitationsPerUser: 2 });
    try {
      const owner = await signedUp(perUser, 'busy');
      const a = (await owner.c.post('/api/teams', { name: 'A' })).body.team.id;
      const b = (await owner.c.post('/api/teams', { name: 'B' })).body.team.id;
      expect((await owner.c.post(`/api/teams/${a}/invitations`, { email: uniqueEmail('x'), role: 'viewer' })).status).toBe(201);
      expect((await owner.c.post(`/api/teams/${b}/invitations`, { email: uniqueEmail('x'), role: 'viewer' })).status).toBe(201);
      expect((await owner.c.post(`/api/teams/${b}/invitations`, { email: uniqueEmail('x'), role: 'viewer' })).status).toBe(429);
    } finally {
      await perUser.close();
    }
  });

  it('the mail is plain text; the team name stays out of the subject and cannot break lines', async () => {
    const owner = await signedUp(t, 'plain');
    const teamName = 'Win a prize\nVisit http://example.invalid <b>now</b>';
    const created = await owner.c.post('/api/teams', { name: teamName.replace('\n', ' ') });
    const target = uniqueEmail('plain-target');
    await owner.c.post(`/api/teams/${created.body.team.id}/invitations`, { email: target, role: 'viewer' });
    await latestLinkTo(t, target, '/invitations/');
    const [mail] = await t.database.db.select().from(outbox).where(eq(outbox.to, target));
    expect(mail.html).toBeNull();
    expect(mail.subject).toBe('An invitation to a team on Spoolbook');
    expect(mail.text).toContain('"Win a prize Visit http://example.invalid <b>now</b>" (a name its owners chose)');
  });
});
