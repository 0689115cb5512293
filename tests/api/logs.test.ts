import { readFileSync } from 'node:fs';
import path from 'node:path';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoLogMapping } from '#server/services/demo-logs';
import { join, ORIGIN, signedUp, startTestApp, teamWithStudy, type Client, type TestApp } from './helpers';

const demoLog = readFileSync(path.resolve(import.meta.dirname, '..', '..', 'data', 'demo', 'logs', 'hillclimb-pulls.csv'));

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

function upload(c: Client, teamId: string, studyId: string, mapping: unknown = demoLogMapping(), file: Buffer = demoLog) {
  return c.agent
    .post(`/api/teams/${teamId}/studies/${studyId}/logs`)
    .set('Origin', ORIGIN)
    .field('mapping', JSON.stringify(mapping))
    .field('name', 'Run 3')
    .field('loggedOn', '2026-06-14')
    .attach('file', file, 'run3.csv');
}

describe('logged runs', () => {
  it('stores an upload and answers its summary; lists it; serves points and fit as CSV', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const res = await upload(owner.c, teamId, study.id);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // The demo log holds 2276 rows over 45.5 s (scripts/generate-demo-log.ts, invented demo data).
    expect(res.body.log).toMatchObject({ name: 'Run 3', loggedOn: '2026-06-14', rows: 2276, duration: 45.5, skipped: [] });
    expect(res.body.log.channels).toEqual(expect.arrayContaining(['time', 'engineSpeed', 'manifoldPressure', 'massAirFlow', 'throttle', 'shaftSpeed']));
    expect(res.body.log.sourceChecksum).toMatch(/^[0-9a-f]{64}$/);

    const list = await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/logs`);
    expect(list.status).toBe(200);
    expect(list.body.logs.map((l: { id: string; name: string }) => [l.id, l.name])).toEqual([[res.body.log.id, 'Run 3']]);

    const points = await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/logs/${res.body.log.id}/points.csv`);
    expect(points.status).toBe(200);
    expect(points.headers['content-type']).toMatch(/text\/csv/);
    const parsed = Papa.parse<string[]>(points.text.trim());
    expect(parsed.data[0]).toEqual(['Time (s)', 'Engine speed (rpm)', 'Manifold pressure (Pa)', 'Corrected mass flow (kg/s)', 'Pressure ratio']);
    // One row per used sample: the three detected pulls (7 s, 7.5 s, 7 s at 50 Hz, scripts/generate-demo-log.ts) hold well over 1000 samples.
    expect(parsed.data.length - 1).toBeGreaterThan(1000);
    expect(parsed.data.slice(1).every((r) => Number(r[4]) >= 1)).toBe(true);

    const fit = await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/logs/${res.body.log.id}/fit.csv`);
    const fitRows = Papa.parse<string[]>(fit.text.trim()).data;
    expect(fitRows[0]).toEqual(['Engine speed (rpm)', 'Volumetric efficiency (fraction)', 'Samples']);
    // The demo log's engine has the study's VE times 0.93 at 2500 rpm rising to 1.01 at 8000 rpm
    // (scripts/generate-demo-log.ts): at 5500 rpm 1.05·(0.93 + 0.08·3000/5500) = 1.0223; the MAP sensor's
    // +2 kPa offset reads the density about 1 % high, so the fit lands near 1.01 (invented demo data).
    const at5500 = fitRows.find((r) => r[0] === '5500')!;
    expect(Number(at5500[1])).toBeGreaterThan(0.99);
    expect(Number(at5500[1])).toBeLessThan(1.03);
  });

  it('lets viewers read but not upload or delete; outsiders see nothing', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const viewer = await join(t, owner.c, teamId, 'viewer', 'log-viewer');
    expect((await upload(viewer.c, teamId, study.id)).status).toBe(403);
    const created = await upload(owner.c, teamId, study.id);
    expect((await viewer.c.get(`/api/teams/${teamId}/studies/${study.id}/logs`)).body.logs).toHaveLength(1);
    expect((await viewer.c.delete(`/api/teams/${teamId}/studies/${study.id}/logs/${created.body.log.id}`)).status).toBe(403);
    const outsider = await signedUp(t, 'log-outsider');
    expect((await outsider.c.get(`/api/teams/${teamId}/studies/${study.id}/logs`)).status).toBe(404);
    expect((await owner.c.delete(`/api/teams/${teamId}/studies/${study.id}/logs/${created.body.log.id}`)).status).toBe(204);
    expect((await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/logs`)).body.logs).toEqual([]);
  });

  it('keeps a chosen selection and refuses one past the last row', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const id = (await upload(owner.c, teamId, study.id)).body.log.id;
    const url = `/api/teams/${teamId}/studies/${study.id}/logs/${id}`;
    const bad = await owner.c.patch(url, { selection: [{ start: 0, end: 99_999 }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/selection\.0\.end/);
    const ok = await owner.c.patch(url, { selection: [{ start: 0, end: 9 }] });
    expect(ok.body.log.selection).toEqual([{ start: 0, end: 9 }]);
    const points = await owner.c.get(`${url}/points.csv`);
    // Ten rows chosen, ten rows out (plus the names).
    expect(points.text.trim().split(/\r?\n/)).toHaveLength(11);
    // Nothing chosen: nothing compared (the names alone), not everything.
    await owner.c.patch(url, { selection: [] });
    expect((await owner.c.get(`${url}/points.csv`)).text.trim().split(/\r?\n/)).toHaveLength(1);
  });

  it('refuses a file over 100 MB with 413 and stores nothing', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const big = Buffer.alloc(100 * 1024 * 1024 + 1, 0x30);
    const res = await upload(owner.c, teamId, study.id, demoLogMapping(), big);
    expect(res.status).toBe(413);
    expect((await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/logs`)).body.logs).toEqual([]);
  });

  it('keeps named mapping presets per team', async () => {
    const { owner, teamId } = await teamWithStudy(t);
    const saved = await owner.c.put(`/api/teams/${teamId}/log-presets`, { name: 'Car 7 logger', mapping: demoLogMapping() });
    expect(saved.status).toBe(200);
    await owner.c.put(`/api/teams/${teamId}/log-presets`, { name: 'Car 7 logger', mapping: demoLogMapping() });
    const list = await owner.c.get(`/api/teams/${teamId}/log-presets`);
    expect(list.body.presets.map((p: { name: string }) => p.name)).toEqual(['Car 7 logger']);
    const bad = await owner.c.put(`/api/teams/${teamId}/log-presets`, { name: 'x', mapping: { columns: [] } });
    expect(bad.status).toBe(400);
    expect((await owner.c.delete(`/api/teams/${teamId}/log-presets/${saved.body.preset.id}`)).status).toBe(204);
  });

  it('goes out with the team archive and comes back in', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const created = (await upload(owner.c, teamId, study.id)).body.log;
    await owner.c.patch(`/api/teams/${teamId}/studies/${study.id}/logs/${created.id}`, { selection: [{ start: 200, end: 549 }] });
    const exported = await owner.c.get(`/api/teams/${teamId}/archive/export`);
    expect(exported.status).toBe(200);
    const archive = JSON.parse(exported.text);
    expect(archive.studies[0].logs).toHaveLength(1);
    const other = await signedUp(t, 'log-importer');
    const target = (await other.c.post('/api/teams', { name: 'Imported' })).body.team.id as string;
    const imported = await other.c.agent
      .post(`/api/teams/${target}/archive/import`)
      .set('Origin', ORIGIN)
      .attach('archive', Buffer.from(JSON.stringify(archive)), { filename: 'team.json', contentType: 'application/json' });
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    const studies = (await other.c.get(`/api/teams/${target}/studies`)).body.studies as { id: string }[];
    const logs = (await other.c.get(`/api/teams/${target}/studies/${studies[0].id}/logs`)).body.logs;
    expect(logs).toHaveLength(1);
    expect(logs[0]).toMatchObject({
      name: 'Run 3',
      rows: created.rows,
      duration: created.duration,
      sourceChecksum: created.sourceChecksum,
      selection: [{ start: 200, end: 549 }],
    });
    const before = await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/logs/${created.id}/points.csv`);
    const after = await other.c.get(`/api/teams/${target}/studies/${studies[0].id}/logs/${logs[0].id}/points.csv`);
    expect(after.text).toBe(before.text);

    // A damaged log refuses the whole archive.
    archive.studies[0].logs[0].samples = Buffer.from('not deflated').toString('base64');
    const broken = await other.c.agent
      .post(`/api/teams/${target}/archive/import`)
      .set('Origin', ORIGIN)
      .attach('archive', Buffer.from(JSON.stringify(archive)), { filename: 'team.json', contentType: 'application/json' });
    expect(broken.status).toBe(400);
    expect(JSON.stringify(broken.body.error.details.problems)).toMatch(/logs\[0\].*samples/);
  });
});
