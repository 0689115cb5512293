import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { teamMembers } from '#server/db/schema';
import { eq } from 'drizzle-orm';
import { adminClient, client, join, signedUp, startTestApp, teamOf, uniqueEmail, type Client, type TestApp } from './helpers';

let t: TestApp;
let admin: Client;
beforeAll(async () => {
  t = await startTestApp();
  admin = await adminClient(t);
});
afterAll(async () => {
  await t.close();
});

type Actor = 'none' | 'viewer' | 'editor' | 'owner' | 'admin';

/** A fresh team with an owner, one member of each role, and a spare viewer to act upon. */
async function teamWithEveryRole() {
  const owner = await signedUp(t, 'owner');
  const created = await owner.c.post('/api/teams', { name: 'Matrix team' });
  const teamId = created.body.team.id as string;
  const people: Record<Actor, Client> = { owner: owner.c, admin } as Record<Actor, Client>;
  for (const role of ['viewer', 'editor'] as const) {
    const p = await signedUp(t, role);
    await t.database.db.insert(teamMembers).values({ teamId, userId: p.user.id, role });
    people[role] = p.c;
  }
  people.none = (await signedUp(t, 'outsider')).c;
  const target = await signedUp(t, 'target');
  await t.database.db.insert(teamMembers).values({ teamId, userId: target.user.id, role: 'viewer' });
  return { teamId, people, targetId: target.user.id };
}

const actions: Record<string, (c: Client, teamId: string, targetId: string) => Promise<{ status: number }>> = {
  'read team': (c, id) => c.get(`/api/teams/${id}`),
  'list members': (c, id) => c.get(`/api/teams/${id}/members`),
  invite: (c, id) => c.post(`/api/teams/${id}/invitations`, { email: uniqueEmail('invitee'), role: 'viewer' }),
  'change role': (c, id, target) => c.patch(`/api/teams/${id}/members/${target}`, { role: 'editor' }),
  'remove member': (c, id, target) => c.delete(`/api/teams/${id}/members/${target}`),
  leave: (c, id) => c.post(`/api/teams/${id}/leave`),
  'delete team': (c, id) => c.delete(`/api/teams/${id}`),
};

// Expected statuses: the product's role model (docs/api.md). 404 hides a team from outsiders;
// 403 says "you may see this but not change it"; the sole owner cannot leave (409).
const expected: Record<string, Record<Actor, number>> = {
  'read team': { none: 404, viewer: 200, editor: 200, owner: 200, admin: 200 },
  'list members': { none: 404, viewer: 200, editor: 200, owner: 200, admin: 200 },
  invite: { none: 404, viewer: 403, editor: 403, owner: 201, admin: 403 },
  'change role': { none: 404, viewer: 403, editor: 403, owner: 200, admin: 403 },
  'remove member': { none: 404, viewer: 403, editor: 403, owner: 204, admin: 403 },
  leave: { none: 404, viewer: 204, editor: 204, owner: 409, admin: 403 },
  'delete team': { none: 404, viewer: 403, editor: 403, owner: 204, admin: 403 },
};

describe('authorization matrix (ASVS 5.0 8.2, 8.3)', () => {
  for (const [action, byActor] of Object.entries(expected)) {
    for (const [actor, status] of Object.entries(byActor) as [Actor, number][]) {
      it(`${actor} → ${action} → ${status}`, async () => {
        const { teamId, people, targetId } = await teamWithEveryRole();
        const res = await actions[action](people[actor], teamId, targetId);
        expect(res.status).toBe(status);
      });
    }
  }

  it('a signed-out request answers 401', async () => {
    const { teamId } = await teamWithEveryRole();
    expect((await client(t).get(`/api/teams/${teamId}`)).status).toBe(401);
  });

  it('a member of team A gets 404 for every object of team B', async () => {
    const a = await teamWithEveryRole();
    const b = await teamWithEveryRole();
    const ownerOfA = a.people.owner;
    const inv = await b.people.owner.post(`/api/teams/${b.teamId}/invitations`, { email: uniqueEmail('b-invitee'), role: 'viewer' });
    const invId = inv.body.invitation.id;
    const attempts = [
      ownerOfA.get(`/api/teams/${b.teamId}`),
      ownerOfA.get(`/api/teams/${b.teamId}/members`),
      ownerOfA.get(`/api/teams/${b.teamId}/invitations`),
      ownerOfA.post(`/api/teams/${b.teamId}/invitations/${invId}/resend`),
      ownerOfA.delete(`/api/teams/${b.teamId}/invitations/${invId}`),
      ownerOfA.patch(`/api/teams/${b.teamId}/members/${b.targetId}`, { role: 'owner' }),
      ownerOfA.delete(`/api/teams/${b.teamId}/members/${b.targetId}`),
      ownerOfA.patch(`/api/teams/${b.teamId}`, { name: 'Taken over' }),
      ownerOfA.delete(`/api/teams/${b.teamId}`),
      ownerOfA.post(`/api/teams/${b.teamId}/leave`),
    ];
    for (const res of await Promise.all(attempts)) expect(res.status).toBe(404);
  });

  it('an invitation of team A cannot be resent or cancelled through team B', async () => {
    const a = await teamWithEveryRole();
    const b = await teamWithEveryRole();
    const inv = await a.people.owner.post(`/api/teams/${a.teamId}/invitations`, { email: uniqueEmail('x'), role: 'viewer' });
    const res = await b.people.owner.delete(`/api/teams/${b.teamId}/invitations/${inv.body.invitation.id}`);
    expect(res.status).toBe(404);
  });
});

describe('owners', () => {
  it('the last owner cannot be demoted or removed; with a second owner they can', async () => {
    const owner = await signedUp(t, 'lastowner');
    const teamId = (await owner.c.post('/api/teams', { name: 'One owner' })).body.team.id;
    expect((await owner.c.patch(`/api/teams/${teamId}/members/${owner.user.id}`, { role: 'editor' })).body.error.code).toBe('last_owner');
    expect((await owner.c.delete(`/api/teams/${teamId}/members/${owner.user.id}`)).status).toBe(409);
    const second = await signedUp(t, 'second');
    await t.database.db.insert(teamMembers).values({ teamId, userId: second.user.id, role: 'owner' });
    expect((await owner.c.patch(`/api/teams/${teamId}/members/${owner.user.id}`, { role: 'editor' })).status).toBe(200);
    expect((await second.c.patch(`/api/teams/${teamId}/members/${second.user.id}`, { role: 'viewer' })).status).toBe(409);
  });

  it('a personal team cannot be deleted or left', async () => {
    const { c, personalTeamId } = await signedUp(t, 'personal');
    expect((await c.delete(`/api/teams/${personalTeamId}`)).status).toBe(400);
    expect((await c.post(`/api/teams/${personalTeamId}/leave`)).status).toBe(400);
  });
});

describe('owner changes are serialised: never a 500', () => {
  it('two owners demoting each other at once, 15 times: each pair ends with one owner, no 500', async () => {
    for (let i = 0; i < 15; i++) {
      const { owner: a, teamId } = await teamOf(t, `race-${i}`);
      const b = await join(t, a.c, teamId, 'owner', `race-b-${i}`);
      const [x, y] = await Promise.all([
        a.c.patch(`/api/teams/${teamId}/members/${b.user.id}`, { role: 'editor' }),
        b.c.patch(`/api/teams/${teamId}/members/${a.user.id}`, { role: 'editor' }),
      ]);
      const statuses = [x.status, y.status].sort();
      // One wins (200); the other finds itself no longer an owner (403) or would leave none (409).
      expect(statuses[0]).toBe(200);
      expect([403, 409]).toContain(statuses[1]);
      const owners = await t.database.db.select().from(teamMembers).where(eq(teamMembers.teamId, teamId));
      expect(owners.filter((m) => m.role === 'owner')).toHaveLength(1);
    }
    // 30 sign-ups (argon2id, slow on purpose) and 15 invitations: on a busy machine this takes
    // longer than the default 30 s; it checks outcomes, never time.
  }, 180_000);
});
