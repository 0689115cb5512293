import { count, eq } from 'drizzle-orm';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { maps, studies, teamMembers } from '#server/db/schema';
import { ADMIN_USER } from '#server/services/demo';
import { demoDocument as demo, join, ORIGIN, signedUp, startTestApp, teamOf, uniqueEmail, type Client, type TestApp } from './helpers';

const root = path.resolve(import.meta.dirname, '..', '..');

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

function importArchive(c: Client, teamId: string, content: string | Buffer) {
  return c.agent
    .post(`/api/teams/${teamId}/archive/import`)
    .set('Origin', ORIGIN)
    .attach('archive', Buffer.isBuffer(content) ? content : Buffer.from(content), { filename: 'team.json', contentType: 'application/json' });
}

/** An archive of one study and no maps, shaped as an export writes it. */
function oneStudyArchive(study: { id: string; title: string; revisions: object[] }) {
  const now = new Date().toISOString();
  return {
    format: 'spoolbook-team-archive',
    version: 1,
    exportedAt: now,
    team: { name: 'x' },
    maps: [],
    studies: [{ id: study.id, title: study.title, archived: false, createdAt: now, revisions: study.revisions }],
  };
}

/** A team with two maps of its own and two studies, one with three revisions using one of them. */
async function populatedTeam() {
  const owner = await signedUp(t, 'exporter');
  const teamId = (await owner.c.post('/api/teams', { name: 'Export team' })).body.team.id as string;
  const up = async (file: string, name: string) =>
    (
      await owner.c.agent
        .post(`/api/teams/${teamId}/maps`)
        .set('Origin', ORIGIN)
        .field('name', name)
        .attach('file', readFileSync(path.join(root, 'data', 'maps', file)), file)
    ).body.map.id as string;
  const m58 = await up('compressor-m58.csv', 'Our M58');
  await up('turbine-t64-ar064-single.csv', 'Our turbine');
  const doc = structuredClone(demo);
  doc.plans[1].compressorMapId = m58;
  const s1 = (await owner.c.post(`/api/teams/${teamId}/studies`, { title: 'With our map', document: doc })).body.study;
  const v2 = structuredClone(doc);
  v2.engine.displacement = 0.0021;
  await owner.c.put(`/api/teams/${teamId}/studies/${s1.id}`, { baseRevision: 1, document: v2, message: 'bigger' });
  const v3 = structuredClone(v2);
  v3.notes = 'ünïcödé 🏁 notes';
  await owner.c.put(`/api/teams/${teamId}/studies/${s1.id}`, { baseRevision: 2, document: v3, message: 'notes' });
  const s2 = (await owner.c.post(`/api/teams/${teamId}/studies`, { title: 'Demo as is', document: demo })).body.study;
  await owner.c.patch(`/api/teams/${teamId}/studies/${s2.id}`, { archived: true });
  return { owner, teamId };
}

/** An archive without ids and timestamps of export, with map references replaced by map names. */
function meaning(archive: {
  maps: { id: string; name: string; [k: string]: unknown }[];
  studies: { revisions: { document: { plans: { compressorMapId: string | null }[] } }[]; [k: string]: unknown }[];
}) {
  const names = new Map(archive.maps.map((m) => [m.id, m.name]));
  return {
    maps: archive.maps.map(({ id: _id, ...m }) => m),
    studies: archive.studies.map(({ id: _id, ...s }) => ({
      ...s,
      revisions: s.revisions.map((r) => ({
        ...r,
        document: {
          ...r.document,
          plans: r.document.plans.map((p) => ({ ...p, compressorMapId: p.compressorMapId ? (names.get(p.compressorMapId) ?? p.compressorMapId) : null })),
        },
      })),
    })),
  };
}

describe('team export and import', () => {
  it('a round trip into another team loses nothing', async () => {
    const { owner, teamId } = await populatedTeam();
    const exported = await owner.c.get(`/api/teams/${teamId}/archive/export`);
    expect(exported.status).toBe(200);
    expect(exported.headers['content-disposition']).toMatch(/attachment; filename="spoolbook-Export-team-\d{4}-\d{2}-\d{2}\.json"/);
    const archive = exported.body;
    expect(archive.maps).toHaveLength(2);
    expect(archive.studies).toHaveLength(2);
    expect(archive.studies[0].revisions.map((r: { revision: number }) => r.revision)).toEqual([1, 2, 3]);

    const target = (await owner.c.post('/api/teams', { name: 'Import team' })).body.team.id;
    const imported = await importArchive(owner.c, target, JSON.stringify(archive));
    expect(imported.status).toBe(201);
    expect(imported.body.imported).toEqual({ maps: 2, studies: 2, revisions: 4 });

    const again = (await owner.c.get(`/api/teams/${target}/archive/export`)).body;
    expect(meaning(again)).toEqual(meaning(archive));
    // The imported study names the imported copy of the map, not the original.
    const importedMapIds = again.maps.map((m: { id: string }) => m.id);
    expect(importedMapIds).toContain(again.studies[0].revisions[2].document.plans[1].compressorMapId);
  });

  it('checks everything first, reports problems by item, and imports nothing when any item is bad', async () => {
    const { owner, teamId } = await populatedTeam();
    const archive = (await owner.c.get(`/api/teams/${teamId}/archive/export`)).body;
    archive.maps[1].fileText = archive.maps[1].fileText.replace('# kind: turbine', '# kind: turbin');
    archive.studies[1].revisions[0].document.engine.cylinders = 0;
    const target = (await owner.c.post('/api/teams', { name: 'Untouched team' })).body.team.id;
    const res = await importArchive(owner.c, target, JSON.stringify(archive));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_archive');
    const items = res.body.error.details.problems.map((p: { item: string }) => p.item);
    expect(items).toContain('maps[1] "Our turbine"');
    expect(items).toContain('studies[1] "Demo as is" revision 1');
    expect(res.body.error.details.problems.find((p: { item: string }) => p.item.startsWith('studies[1]')).message).toMatch(/^document\.engine\.cylinders/);
    const [m] = await t.database.db.select({ n: count() }).from(maps).where(eq(maps.teamId, target));
    const [s] = await t.database.db.select({ n: count() }).from(studies).where(eq(studies.teamId, target));
    expect([m.n, s.n]).toEqual([0, 0]);
  });

  it('refuses what is not an archive, with a clear message', async () => {
    const owner = await signedUp(t, 'notarchive');
    const notJson = await importArchive(owner.c, owner.personalTeamId, 'this is not json');
    expect(notJson.status).toBe(400);
    expect(notJson.body.error.message).toMatch(/not valid JSON/);
    const wrong = await importArchive(owner.c, owner.personalTeamId, JSON.stringify({ format: 'something else' }));
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details.problems[0].item).toBe('archive');
    const missingMap = oneStudyArchive({
      id: 's',
      title: 'Orphan',
      revisions: [
        {
          revision: 1,
          title: 'Orphan',
          message: '',
          author: null,
          createdAt: new Date().toISOString(),
          document: { ...demo, plans: [{ ...demo.plans[0], compressorMapId: 'gone' }] },
        },
      ],
    });
    const orphan = await importArchive(owner.c, owner.personalTeamId, JSON.stringify(missingMap));
    expect(orphan.status).toBe(400);
    expect(orphan.body.error.details.problems[0].message).toMatch(/compressorMapId: names map gone/);
  });

  it('only owners export and import', async () => {
    const { owner, teamId } = await populatedTeam();
    const editor = await signedUp(t, 'archiveeditor');
    await t.database.db.insert(teamMembers).values({ teamId, userId: editor.user.id, role: 'editor' });
    expect((await editor.c.get(`/api/teams/${teamId}/archive/export`)).status).toBe(403);
    expect((await importArchive(editor.c, teamId, '{}')).status).toBe(403);
    const stranger = await signedUp(t, 'archivestranger');
    expect((await stranger.c.get(`/api/teams/${teamId}/archive/export`)).status).toBe(404);
    expect(owner.email).toBeTruthy();
  });
});

describe("archive import matches authors only among the team's members", () => {
  it('an archive naming the site admin as author does not make history say "by Site Admin"; a member is matched', async () => {
    const { owner, teamId } = await teamOf(t, 'archive');
    const editor = await join(t, owner.c, teamId, 'editor', 'archive-editor');
    const revision = (n: number, author: string) => ({
      revision: n,
      title: 'Imported',
      message: `r${n}`,
      author,
      createdAt: new Date().toISOString(),
      document: demo,
    });
    const archive = oneStudyArchive({
      id: 's1',
      title: 'Imported',
      revisions: [revision(1, ADMIN_USER.email), revision(2, editor.email), revision(3, uniqueEmail('stranger'))],
    });
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
