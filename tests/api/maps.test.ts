import { count, eq } from 'drizzle-orm';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FORMULA_START } from '#shared/csv';
import { parseMapFile } from '#shared/maps';
import { maps, teamMembers } from '#server/db/schema';
import { expectErrorShape, ORIGIN, signedUp, startTestApp, teamOf, type Client, type TestApp } from './helpers';

const fixtures = path.resolve(import.meta.dirname, '..', 'fixtures', 'maps');
const demoMaps = path.resolve(import.meta.dirname, '..', '..', 'data', 'maps');
const expected = JSON.parse(readFileSync(path.join(fixtures, 'bad', 'expected.json'), 'utf8')).files as Record<
  string,
  { code: string; line: number | null; column: number | null; message: string }[]
>;

let t: TestApp;
let owner: Awaited<ReturnType<typeof signedUp>>;
let teamId: string;
beforeAll(async () => {
  t = await startTestApp();
  owner = await signedUp(t, 'maps');
  teamId = (await owner.c.post('/api/teams', { name: 'Map team' })).body.team.id;
});
afterAll(async () => {
  await t.close();
});

function upload(c: Client, team: string, fileName: string, content: Buffer | string, fields: Record<string, string> = {}) {
  let req = c.agent.post(`/api/teams/${team}/maps`).set('Origin', ORIGIN);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content), { filename: fileName, contentType: 'text/csv' });
}

async function mapRows(team: string) {
  const [row] = await t.database.db.select({ n: count() }).from(maps).where(eq(maps.teamId, team));
  return row.n;
}

describe('upload, read, edit, download, delete', () => {
  it('uploads a demo map, lists it beside the built-in ones, and reads it back', async () => {
    const text = readFileSync(path.join(demoMaps, 'compressor-m58.csv'), 'utf8');
    const res = await upload(owner.c, teamId, 'compressor-m58.csv', text);
    expect(res.status).toBe(201);
    expect(res.body.map).toMatchObject({ kind: 'compressor', builtin: false });
    // Accepted with a note: its islands meet on the surge line, read by the documented rule (docs/map-format.md).
    expect(res.body.notes.map((n: { code: string }) => n.code)).toEqual(['coincident-points-merged']);
    const list = await owner.c.get(`/api/teams/${teamId}/maps`);
    expect(list.body.maps.filter((m: { builtin: boolean }) => !m.builtin)).toHaveLength(1);
    // data/maps holds 4 compressor and 4 turbine demo files (scripts/generate-demo-maps.ts).
    expect(list.body.maps.filter((m: { builtin: boolean }) => m.builtin)).toHaveLength(readdirSync(demoMaps).filter((f) => f.endsWith('.csv')).length);
    const one = await owner.c.get(`/api/teams/${teamId}/maps/${res.body.map.id}`);
    expect(one.body.map.map.curves.length).toBeGreaterThan(3);
  });

  it('renames and annotates; the download carries the new name and parses to the same map', async () => {
    const text = readFileSync(path.join(demoMaps, 'compressor-s44.csv'), 'utf8');
    const created = await upload(owner.c, teamId, 'small.csv', text);
    const id = created.body.map.id;
    const patched = await owner.c.patch(`/api/teams/${teamId}/maps/${id}`, { name: 'Street wheel, as tested', notes: 'Checked against the shop copy.' });
    expect(patched.status).toBe(200);
    const file = await owner.c.get(`/api/teams/${teamId}/maps/${id}/file`);
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toMatch(/text\/csv/);
    expect(file.headers['content-disposition']).toMatch(/attachment; filename="Street-wheel-as-tested\.csv"/);
    const again = parseMapFile(file.text);
    const original = parseMapFile(text);
    if (!again.ok || !original.ok) throw new Error('download or original did not parse');
    expect(again.map.name).toBe('Street wheel, as tested');
    expect(again.map.curves).toEqual(original.map.curves);
    // Upload the download again: the same map in meaning.
    const reuploaded = await upload(owner.c, teamId, 'again.csv', file.text);
    expect(reuploaded.status).toBe(201);
    expect(reuploaded.body.map.map.curves).toEqual(original.map.curves);
  });

  it("keeps what a turbine map's efficiency counts through upload, list, download and upload", async () => {
    const text = readFileSync(path.join(demoMaps, 'turbine-t64-ar082-single.csv'), 'utf8');
    expect(text).toContain('# efficiency kind: total-to-static, with bearing losses\n'); // the demo maps state theirs (docs/map-format.md)
    const created = await upload(owner.c, teamId, 't.csv', text);
    expect(created.status).toBe(201);
    expect(created.body.map.map.efficiencyKind).toBe('with-bearing-losses');
    const list = await owner.c.get(`/api/teams/${teamId}/maps?kind=turbine`);
    const mine = list.body.maps.find((m: { id: string }) => m.id === created.body.map.id);
    expect(mine.summary.efficiencyKind).toBe('with-bearing-losses');
    const file = await owner.c.get(`/api/teams/${teamId}/maps/${created.body.map.id}/file`);
    expect(file.text).toContain('# efficiency kind: total-to-static, with bearing losses\n');
    const again = await upload(owner.c, teamId, 'again.csv', file.text.replace('total-to-static, with bearing losses', 'aerodynamic only'));
    expect(again.body.map.map.efficiencyKind).toBe('aerodynamic');
    const unstated = await upload(owner.c, teamId, 'plain.csv', text.replace(/# efficiency kind: .*\n/, ''));
    expect(unstated.body.map.summary.efficiencyKind).toBeNull();
    for (const id of [created.body.map.id, again.body.map.id, unstated.body.map.id]) await owner.c.delete(`/api/teams/${teamId}/maps/${id}`);
  });

  it('downloads a built-in map; built-in maps cannot be changed or deleted', async () => {
    const list = await owner.c.get(`/api/teams/${teamId}/maps?kind=turbine`);
    const builtin = list.body.maps.find((m: { builtin: boolean }) => m.builtin);
    expect(builtin.kind).toBe('turbine');
    expect((await owner.c.get(`/api/teams/${teamId}/maps/${builtin.id}/file`)).status).toBe(200);
    expect((await owner.c.patch(`/api/teams/${teamId}/maps/${builtin.id}`, { name: 'Mine now' })).status).toBe(403);
    expect((await owner.c.delete(`/api/teams/${teamId}/maps/${builtin.id}`)).status).toBe(403);
  });

  it('deletes a map no study uses', async () => {
    const created = await upload(owner.c, teamId, 'l.csv', readFileSync(path.join(demoMaps, 'compressor-l76.csv')));
    expect((await owner.c.delete(`/api/teams/${teamId}/maps/${created.body.map.id}`)).status).toBe(204);
    expect((await owner.c.get(`/api/teams/${teamId}/maps/${created.body.map.id}`)).status).toBe(404);
  });

  it('viewers read, only editors and owners upload and edit; other teams get 404', async () => {
    const viewer = await signedUp(t, 'mapviewer');
    await t.database.db.insert(teamMembers).values({ teamId, userId: viewer.user.id, role: 'viewer' });
    const editor = await signedUp(t, 'mapeditor');
    await t.database.db.insert(teamMembers).values({ teamId, userId: editor.user.id, role: 'editor' });
    const text = readFileSync(path.join(demoMaps, 'compressor-m58.csv'), 'utf8');
    expect((await upload(viewer.c, teamId, 'v.csv', text)).status).toBe(403);
    const made = await upload(editor.c, teamId, 'e.csv', text);
    expect(made.status).toBe(201);
    expect((await viewer.c.get(`/api/teams/${teamId}/maps/${made.body.map.id}`)).status).toBe(200);
    expect((await viewer.c.patch(`/api/teams/${teamId}/maps/${made.body.map.id}`, { name: 'x' })).status).toBe(403);
    const outsider = await signedUp(t, 'mapoutsider');
    expect((await outsider.c.get(`/api/teams/${teamId}/maps/${made.body.map.id}`)).status).toBe(404);
    expect((await outsider.c.get(`/api/teams/${teamId}/maps/${made.body.map.id}/file`)).status).toBe(404);
    // Using one's own team id with another team's map id is a 404 too.
    expect((await outsider.c.get(`/api/teams/${outsider.personalTeamId}/maps/${made.body.map.id}`)).status).toBe(404);
  });
});

describe('bad files: every problem listed, 400, nothing saved', () => {
  for (const [file, problems] of Object.entries(expected)) {
    if (file.startsWith('(generated)')) continue;
    it(file, async () => {
      const before = await mapRows(teamId);
      const res = await upload(owner.c, teamId, file, readFileSync(path.join(fixtures, 'bad', file)));
      if (problems.length === 0) {
        // Accepted with a note (for example an island closed automatically).
        expect(res.status).toBe(201);
        await owner.c.delete(`/api/teams/${teamId}/maps/${res.body.map.id}`);
        return;
      }
      expect(res.status).toBe(400);
      expectErrorShape(res.body);
      expect(res.body.error.code).toBe('invalid_map_file');
      const got = res.body.error.details.problems as { code: string; line: number | null; column: number | null; message: string }[];
      for (const want of problems) {
        expect(got.some((p) => p.code === want.code && p.line === want.line && p.column === want.column && p.message.includes(want.message))).toBe(true);
      }
      expect(await mapRows(teamId)).toBe(before);
    });
  }

  it('binary data is refused as not text', async () => {
    const before = await mapRows(teamId);
    const bytes = Buffer.from(Array.from({ length: 2048 }, (_, i) => (i * 37) % 256));
    const res = await upload(owner.c, teamId, 'picture.csv', bytes);
    expect(res.status).toBe(400);
    expect(res.body.error.details.problems[0].code).toBe('not-text');
    expect(await mapRows(teamId)).toBe(before);
  });

  it('a file over 2 MB answers 413 and saves nothing', async () => {
    const before = await mapRows(teamId);
    // The format's limit is 2 MB (shared/maps/format.ts MAX_MAP_FILE_BYTES).
    const res = await upload(owner.c, teamId, 'huge.csv', Buffer.alloc(2 * 1024 * 1024 + 10, 'a'));
    expect(res.status).toBe(413);
    expectErrorShape(res.body);
    expect(await mapRows(teamId)).toBe(before);
  });

  it('a request without a file names the field', async () => {
    const res = await owner.c.agent.post(`/api/teams/${teamId}/maps`).set('Origin', ORIGIN).field('name', 'No file');
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path).toBe('file');
  });

  it('two files in one request are refused', async () => {
    const text = readFileSync(path.join(demoMaps, 'compressor-m58.csv'));
    const res = await owner.c.agent.post(`/api/teams/${teamId}/maps`).set('Origin', ORIGIN).attach('file', text, 'a.csv').attach('file', text, 'b.csv');
    expect(res.status).toBe(400);
    expectErrorShape(res.body);
  });

  it('an unknown form field is refused by name', async () => {
    const res = await upload(owner.c, teamId, 'm.csv', readFileSync(path.join(demoMaps, 'compressor-m58.csv')), { owner: 'someone else' });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error.details)).toContain('owner');
  });
});

describe('CSV downloads never carry a live formula (OWASP CSV injection, ASVS 1.2.10)', () => {
  it('a map renamed `Map,=HYPERLINK(...)` downloads with the name in one quoted cell', async () => {
    const { owner, teamId } = await teamOf(t, 'csv');
    const up = await owner.c.agent
      .post(`/api/teams/${teamId}/maps`)
      .set('Origin', ORIGIN)
      .attach('file', readFileSync(path.join(demoMaps, 'compressor-m58.csv')), 'compressor-m58.csv');
    const mapId = up.body.map.id;
    const name = 'Map,=HYPERLINK("http://example.invalid","x")';
    expect((await owner.c.patch(`/api/teams/${teamId}/maps/${mapId}`, { name, notes: 'first, -second\n@third' })).status).toBe(200);
    const file = await owner.c.get(`/api/teams/${teamId}/maps/${mapId}/file`);
    const cells = Papa.parse<string[]>(file.text, { delimiter: ',' }).data.flat();
    expect(cells.filter((c) => FORMULA_START.test(c) && Number.isNaN(Number(c)))).toEqual([]);
    expect(cells).toContain(`# name: ${name}`);
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
              .attach('file', readFileSync(path.join(demoMaps, 'compressor-m58.csv')), 'm58.csv')
          ).status,
        );
      }
      expect(statuses).toEqual([201, 201, 429]); // 2 per user per hour in this test's settings
    } finally {
      await limited.close();
    }
  });
});
