import { eq } from 'drizzle-orm';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, maps, studies, teamMembers } from '#server/db/schema';
import { demoDocument, expectErrorShape, join, ORIGIN, signedUp, startTestApp, teamOf, type Client, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const turbineDemo = JSON.parse(readFileSync(path.resolve(import.meta.dirname, '..', '..', 'data', 'demo', 'turbine-housing-study.json'), 'utf8'));

describe('a new study blank or from a template', () => {
  it('starts blank: one plan without a map and one scenario, with ids on its scenario and row', async () => {
    const owner = await signedUp(t, 'blank');
    const res = await owner.c.post(`/api/teams/${owner.personalTeamId}/studies`, { title: 'Blank one', start: 'blank' });
    expect(res.status).toBe(201);
    const doc = res.body.study.document;
    expect(doc.plans).toEqual([expect.objectContaining({ name: 'Plan 1', compressorMapId: null })]);
    expect(doc.scenarios).toHaveLength(1);
    expect(doc.scenarios[0].id).toBe('scenario-1');
    expect(doc.scenarios[0].boostSchedule[0].id).toBe('row-1');
    const history = await owner.c.get(`/api/teams/${owner.personalTeamId}/studies/${res.body.study.id}/revisions`);
    expect(history.body.revisions[0].message).toBe('Started blank');
  });

  it('starts from either demo study as a template', async () => {
    const owner = await signedUp(t, 'template');
    const hill = await owner.c.post(`/api/teams/${owner.personalTeamId}/studies`, { title: 'Hill', start: 'demo-hillclimb' });
    expect(hill.status).toBe(201);
    expect(hill.body.study.document.plans.map((p: { id: string }) => p.id)).toEqual(demoDocument.plans.map((p: { id: string }) => p.id));
    const exhaust = await owner.c.post(`/api/teams/${owner.personalTeamId}/studies`, { title: 'Exhaust', start: 'demo-exhaust' });
    expect(exhaust.status).toBe(201);
    expect(exhaust.body.study.document.notes).toBe(turbineDemo.notes);
  });

  it('refuses an unknown template and a document given with a template, by field, and saves nothing', async () => {
    const owner = await signedUp(t, 'bad-start');
    const url = `/api/teams/${owner.personalTeamId}/studies`;
    const unknown = await owner.c.post(url, { title: 'X', start: 'empty' });
    expect(unknown.status).toBe(400);
    expectErrorShape(unknown.body);
    expect(unknown.body.error.message).toMatch(/start/);
    const both = await owner.c.post(url, { title: 'X', start: 'blank', document: demoDocument });
    expect(both.status).toBe(400);
    expect(both.body.error.message).toMatch(/start: give a document or a start, not both/);
    expect(await t.database.db.select().from(studies).where(eq(studies.teamId, owner.personalTeamId))).toEqual([]);
  });
});

/** Uploads a demo map file to a team's library and answers its id. */
async function uploadMap(c: Client, teamId: string, file: string): Promise<string> {
  const text = readFileSync(path.resolve(import.meta.dirname, '..', '..', 'data', 'maps', file));
  const res = await c.agent.post(`/api/teams/${teamId}/maps`).set('Origin', ORIGIN).attach('file', text, { filename: file, contentType: 'text/csv' });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  return res.body.map.id;
}

/** A team whose one study uses a map of its own library on its first plan, with a viewer. */
async function sharedTeam(prefix: string) {
  const { owner, teamId } = await teamOf(t, prefix);
  const mapId = await uploadMap(owner.c, teamId, 'compressor-m58.csv');
  const document = structuredClone(demoDocument);
  document.plans[0].compressorMapId = mapId;
  const created = await owner.c.post(`/api/teams/${teamId}/studies`, { title: 'Team study', document });
  if (created.status !== 201) throw new Error(JSON.stringify(created.body));
  const viewer = await join(t, owner.c, teamId, 'viewer', `${prefix}-viewer`);
  return { owner, teamId, mapId, study: created.body.study as { id: string; document: typeof demoDocument }, viewer };
}

describe('copy to my team', () => {
  it('lets a viewer copy a study into their own team, with the team map it uses, and records it in both teams', async () => {
    const { teamId, mapId, study, viewer } = await sharedTeam('copy');
    const res = await viewer.c.post(`/api/teams/${teamId}/studies/${study.id}/copy`, { teamId: viewer.personalTeamId });
    expect(res.status).toBe(201);
    const copy = res.body.study;
    expect(copy.teamId).toBe(viewer.personalTeamId);
    expect(copy.title).toBe('Team study');
    expect(copy.revision).toBe(1);
    expect(copy.canEdit).toBe(true);
    // The plan names a copy of the map in the viewer's team, not the original team's map.
    const copiedMapId = copy.document.plans[0].compressorMapId;
    expect(copiedMapId).not.toBe(mapId);
    const [copiedMap] = await t.database.db.select().from(maps).where(eq(maps.id, copiedMapId));
    const [originalMap] = await t.database.db.select().from(maps).where(eq(maps.id, mapId));
    expect(copiedMap.teamId).toBe(viewer.personalTeamId);
    expect(copiedMap.fileText).toBe(originalMap.fileText);
    // Built-in maps stay as they are.
    expect(copy.document.plans[1].compressorMapId).toBe(demoDocument.plans[1].compressorMapId);
    // The copy computes: the viewer's own team can read it and its map.
    expect((await viewer.c.get(`/api/teams/${viewer.personalTeamId}/maps/${copiedMapId}`)).status).toBe(200);
    expect((await viewer.c.get(`/api/teams/${viewer.personalTeamId}/studies/${copy.id}/results.csv`)).status).toBe(200);
    const history = await viewer.c.get(`/api/teams/${viewer.personalTeamId}/studies/${copy.id}/revisions`);
    expect(history.body.revisions[0].message).toBe('Copied from "Team study" revision 1 of copy team');
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.actorId, viewer.user.id));
    expect(events.map((e) => [e.action, e.teamId]).filter(([a]) => String(a).startsWith('study.'))).toEqual(
      expect.arrayContaining([
        ['study.copied-out', teamId],
        ['study.copied-in', viewer.personalTeamId],
      ]),
    );
    // The original is untouched.
    const original = await viewer.c.get(`/api/teams/${teamId}/studies/${study.id}`);
    expect(original.body.study.document.plans[0].compressorMapId).toBe(mapId);
  });

  it('takes a new title when given one', async () => {
    const { teamId, study, viewer } = await sharedTeam('copy-title');
    const res = await viewer.c.post(`/api/teams/${teamId}/studies/${study.id}/copy`, { teamId: viewer.personalTeamId, title: 'My try' });
    expect(res.status).toBe(201);
    expect(res.body.study.title).toBe('My try');
  });

  it('refuses a team the caller cannot write in (403 as viewer, 404 not a member) and one they cannot read from, copying nothing', async () => {
    const { owner, teamId, study, viewer } = await sharedTeam('copy-refused');
    const other = await teamOf(t, 'copy-other');
    const viewerThere = await join(t, other.owner.c, other.teamId, 'viewer', 'copy-other-viewer');
    // A viewer of the target team may not add a study there.
    await t.database.db.insert(teamMembers).values({ teamId, userId: viewerThere.user.id, role: 'viewer' });
    const asViewer = await viewerThere.c.post(`/api/teams/${teamId}/studies/${study.id}/copy`, { teamId: other.teamId });
    expect(asViewer.status).toBe(403);
    // A team the caller is not in does not exist for them.
    const notMember = await viewer.c.post(`/api/teams/${teamId}/studies/${study.id}/copy`, { teamId: other.teamId });
    expect(notMember.status).toBe(404);
    // A study of a team the caller cannot read.
    const outsider = await signedUp(t, 'copy-outsider');
    const stranger = await outsider.c.post(`/api/teams/${teamId}/studies/${study.id}/copy`, { teamId: outsider.personalTeamId });
    expect(stranger.status).toBe(404);
    // Into the same team: Duplicate is for that.
    const same = await owner.c.post(`/api/teams/${teamId}/studies/${study.id}/copy`, { teamId });
    expect(same.status).toBe(400);
    expect(same.body.error.message).toMatch(/already in this team/);
    const missing = await viewer.c.post(`/api/teams/${teamId}/studies/${study.id}/copy`, {});
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toMatch(/teamId/);
    for (const team of [other.teamId, outsider.personalTeamId]) {
      expect(await t.database.db.select().from(studies).where(eq(studies.teamId, team))).toEqual([]);
      expect(await t.database.db.select().from(maps).where(eq(maps.teamId, team))).toEqual([]);
    }
  });

  it('answers 404 for a study that is not in the team', async () => {
    const { teamId, viewer } = await sharedTeam('copy-missing');
    const res = await viewer.c.post(`/api/teams/${teamId}/studies/nope/copy`, { teamId: viewer.personalTeamId });
    expect(res.status).toBe(404);
  });
});
