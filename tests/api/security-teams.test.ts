import { readFileSync } from 'node:fs';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { outbox, teamMembers } from '#server/db/schema';
import { ADMIN_USER } from '#server/services/demo';
import { FORMULA_START } from '#shared/csv';
import { pngPicture } from '../unit/tracer/images';
import { latestLinkTo, ORIGIN, signedUp, startTestApp, uniqueEmail, type Client, type TestApp } from './helpers';

// Each test reproduces an attack from the security review of issue 14 and shows it refused.

const root = path.resolve(import.meta.dirname, '..', '..');
const demo = JSON.parse(readFileSync(path.join(root, 'data', 'demo', 'hillclimb-study.json'), 'utf8'));

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t?.close();
});

async function teamOf(prefix: string) {
  const owner = await signedUp(t, prefix);
  const teamId = (await owner.c.post('/api/teams', { name: `${prefix} team` })).body.team.id as string;
  return { owner, teamId };
}

async function join(owner: Client, teamId: string, role: 'owner' | 'editor' | 'viewer', prefix: string) {
  const member = await signedUp(t, prefix);
  await owner.post(`/api/teams/${teamId}/invitations`, { email: member.email, role });
  const token = (await latestLinkTo(t, member.email, '/invitations/')).split('/invitations/')[1];
  expect((await member.c.post(`/api/invitations/${token}/accept`, {})).status).toBe(200);
  return member;
}

describe("archive import matches authors only among the team's members", () => {
  it('an archive naming the site admin as author does not make history say "by Site Admin"; a member is matched', async () => {
    const { owner, teamId } = await teamOf('archive');
    const editor = await join(owner.c, teamId, 'editor', 'archive-editor');
    const revision = (n: number, author: string) => ({
      revision: n,
      title: 'Imported',
      message: `r${n}`,
      author,
      createdAt: new Date().toISOString(),
      document: demo,
    });
    const archive = {
      format: 'spoolbook-team-archive',
      version: 1,
      exportedAt: new Date().toISOString(),
      team: { name: 'x' },
      maps: [],
      studies: [
        {
          id: 's1',
          title: 'Imported',
          archived: false,
          createdAt: new Date().toISOString(),
          revisions: [revision(1, ADMIN_USER.email), revision(2, editor.email), revision(3, uniqueEmail('stranger'))],
        },
      ],
    };
    const res = await owner.c.agent
      .post(`/api/teams/${teamId}/archive/import`)
      .set('Origin', ORIGIN)
      .attach('archive', Buffer.from(JSON.stringify(archive)), { filename: 'team.json', contentType: 'application/json' });
    expect(res.status).toBe(201);
    const list = await owner.c.get(`/api/teams/${teamId}/studies?q=Imported`);
    const studyId = list.body.studies[0].id;
    const revisions = (await owner.c.get(`/api/teams/${teamId}/studies/${studyId}/revisions`)).body.revisions as { revision: number; author: string }[];
    const byNumber = Object.fromEntries(revisions.map((r) => [r.revision, r.author]));
    expect(byNumber[1]).toBe(ADMIN_USER.email); // plain text, not the admin's name
    expect(byNumber[1]).not.toBe(ADMIN_USER.name);
    expect(byNumber[2]).toBe((await editor.c.get('/api/auth/me')).body.user.name); // a member: matched
    expect(byNumber[3]).toMatch(/^stranger-/);
  });
});

describe('CSV downloads never carry a live formula (OWASP CSV injection, ASVS 1.2.10)', () => {
  it('a map renamed `Map,=HYPERLINK(...)` downloads with the name in one quoted cell', async () => {
    const { owner, teamId } = await teamOf('csv');
    const up = await owner.c.agent
      .post(`/api/teams/${teamId}/maps`)
      .set('Origin', ORIGIN)
      .attach('file', readFileSync(path.join(root, 'data', 'maps', 'compressor-m58.csv')), 'compressor-m58.csv');
    const mapId = up.body.map.id;
    const name = 'Map,=HYPERLINK("http://example.invalid","x")';
    expect((await owner.c.patch(`/api/teams/${teamId}/maps/${mapId}`, { name, notes: 'first, -second\n@third' })).status).toBe(200);
    const file = await owner.c.get(`/api/teams/${teamId}/maps/${mapId}/file`);
    const cells = Papa.parse<string[]>(file.text, { delimiter: ',' }).data.flat();
    expect(cells.filter((c) => FORMULA_START.test(c) && Number.isNaN(Number(c)))).toEqual([]);
    expect(cells).toContain(`# name: ${name}`);
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

describe('owner changes are serialised: never a 500', () => {
  it('two owners demoting each other at once, 15 times: each pair ends with one owner, no 500', async () => {
    for (let i = 0; i < 15; i++) {
      const { owner: a, teamId } = await teamOf(`race-${i}`);
      const b = await join(a.c, teamId, 'owner', `race-b-${i}`);
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
  });
});

describe('share links: 30 days by default, ending with their maker unless kept', () => {
  async function studyOf(owner: Client, teamId: string) {
    return (await owner.post(`/api/teams/${teamId}/studies`, { title: 'Shared', document: demo })).body.study.id as string;
  }

  it('expires in 30 days unless the maker chooses never', async () => {
    const { owner, teamId } = await teamOf('share-default');
    const studyId = await studyOf(owner.c, teamId);
    const made = await owner.c.post(`/api/teams/${teamId}/studies/${studyId}/share-links`, {});
    const days = (Date.parse(made.body.shareLink.expiresAt) - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(29.9);
    expect(days).toBeLessThanOrEqual(30); // 30 days, the default the issue sets
    const never = await owner.c.post(`/api/teams/${teamId}/studies/${studyId}/share-links`, { expiresInDays: null });
    expect(never.body.shareLink.expiresAt).toBeNull();
  });

  it('a link stops when its maker leaves the team; one an owner kept goes on', async () => {
    const { owner, teamId } = await teamOf('share-leave');
    const editor = await join(owner.c, teamId, 'editor', 'share-editor');
    const studyId = await studyOf(owner.c, teamId);
    const plain = (await editor.c.post(`/api/teams/${teamId}/studies/${studyId}/share-links`, {})).body.shareLink;
    const kept = (await editor.c.post(`/api/teams/${teamId}/studies/${studyId}/share-links`, {})).body.shareLink;
    expect((await editor.c.put(`/api/teams/${teamId}/studies/${studyId}/share-links/${kept.id}/kept`, { kept: true })).status).toBe(403); // owners only
    expect((await owner.c.put(`/api/teams/${teamId}/studies/${studyId}/share-links/${kept.id}/kept`, { kept: true })).status).toBe(200);
    const tokenOf = (url: string) => url.split('/share/')[1];
    expect((await owner.c.get(`/api/share/${tokenOf(plain.url)}`)).status).toBe(200);
    expect((await editor.c.post(`/api/teams/${teamId}/leave`, {})).status).toBe(204);
    expect((await owner.c.get(`/api/share/${tokenOf(plain.url)}`)).status).toBe(404);
    expect((await owner.c.get(`/api/share/${tokenOf(kept.url)}`)).status).toBe(200);
  });
});

describe('uploads are limited per user per hour', () => {
  it('the 3rd map upload is refused with 429 before the file is read', async () => {
    const limited = await startTestApp({}, { uploadsPerUser: 2 });
    try {
      const owner = await signedUp(limited, 'uploader');
      const statuses: number[] = [];
      for (let i = 0; i < 3; i++) {
        statuses.push(
          (
            await owner.c.agent
              .post(`/api/teams/${owner.personalTeamId}/maps`)
              .set('Origin', ORIGIN)
              .attach('file', readFileSync(path.join(root, 'data', 'maps', 'compressor-m58.csv')), 'm58.csv')
          ).status,
        );
      }
      expect(statuses).toEqual([201, 201, 429]); // 2 per user per hour in this test's settings
    } finally {
      await limited.close();
    }
  });
});

describe('pictures cannot be framed', () => {
  it("a Tracer picture is served with frame-ancestors 'none'", async () => {
    const owner = await signedUp(t, 'picture');
    const png = pngPicture(40, 30);
    const up = await owner.c.agent.post(`/api/teams/${owner.personalTeamId}/tracer/images`).set('Origin', ORIGIN).attach('file', png, 'tiny.png');
    expect(up.status).toBe(201);
    const res = await owner.c.get(`/api/teams/${owner.personalTeamId}/tracer/images/${up.body.image.id}`);
    expect(res.headers['content-security-policy']).toContain("frame-ancestors 'none'");
  });
});
