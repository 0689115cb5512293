import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { teamMembers } from '#server/db/schema';
import { expectErrorShape, signedUp, startTestApp, teamWithStudy, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const csvOf = (text: string) => Papa.parse<string[]>(text.trim(), { skipEmptyLines: true }).data;
const builtinCount = (prefix: string) => {
  const folder = path.resolve(import.meta.dirname, '..', '..', 'data', 'maps');
  return readdirSync(folder).filter((f) => f.startsWith(prefix) && f.endsWith('.csv')).length;
};
const turbineStudy = JSON.parse(readFileSync(path.resolve(import.meta.dirname, '..', '..', 'data', 'demo', 'turbine-housing-study.json'), 'utf8'));

describe('GET …/studies/:id/candidates.csv', () => {
  it('answers one row per compressor map (built-in ones too) with exactly the contract’s columns, what fits first', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const res = await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/candidates.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const [head, ...rows] = csvOf(res.text);
    expect(head).toEqual(['Map', 'Kind', 'Verdict', 'First reason', 'Worst surge margin', 'Worst choke margin', 'Worst speed margin']);
    expect(rows).toHaveLength(builtinCount('compressor-'));
    for (const row of rows) expect(row[1]).toBe('compressor');
    const order = ['Fits', 'Fits with warnings', 'Not judged', 'Does not fit'];
    const ranks = rows.map((r) => order.indexOf(r[2]));
    expect(ranks.every((r) => r >= 0)).toBe(true);
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
    // A map that does not fit says why; every margin is a number or empty.
    for (const row of rows.filter((r) => r[2] === 'Does not fit')) expect(row[3]).not.toBe('');
    for (const row of rows) for (const cell of row.slice(4)) expect(cell === '' || Number.isFinite(Number(cell))).toBe(true);
  });

  it('ranks the turbine housings for a chosen compressor', async () => {
    const { owner, teamId } = await teamWithStudy(t);
    const created = await owner.c.post(`/api/teams/${teamId}/studies`, { title: 'Housings', document: turbineStudy });
    const res = await owner.c.get(`/api/teams/${teamId}/studies/${created.body.study.id}/candidates.csv?kind=turbine&compressorMapId=builtin-compressor-m58`);
    expect(res.status).toBe(200);
    const [head, ...rows] = csvOf(res.text);
    expect(head[0]).toBe('Map');
    expect(rows).toHaveLength(builtinCount('turbine-'));
    for (const row of rows) expect(row[1]).toBe('turbine');
  });

  it('refuses a bad query with 400 and says what is wrong', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const base = `/api/teams/${teamId}/studies/${study.id}/candidates.csv`;
    const cases: Array<[string, RegExp]> = [
      ['?kind=pump', /kind: kind must be compressor or turbine/],
      ['?kind=turbine', /compressorMapId: is required with kind=turbine/],
      ['?kind=turbine&compressorMapId=builtin-compressor-m58', /no plan with an exhaust side/],
      ['?order=cheapest', /order must be smallest/],
      ['?colour=red', /colour/],
      ['?planId=nope', /planId: no such plan/],
    ];
    for (const [query, message] of cases) {
      const res = await owner.c.get(base + query);
      expect(res.status, query).toBe(400);
      expectErrorShape(res.body);
      expect(res.body.error.message, query).toMatch(message);
    }
  });

  it('refuses a compressor that is not in the library, for turbines', async () => {
    const { owner, teamId } = await teamWithStudy(t);
    const created = await owner.c.post(`/api/teams/${teamId}/studies`, { title: 'Housings', document: turbineStudy });
    const res = await owner.c.get(`/api/teams/${teamId}/studies/${created.body.study.id}/candidates.csv?kind=turbine&compressorMapId=nope`);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/compressorMapId: no such compressor map/);
  });

  it('lets a viewer read it, and no one outside the team', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const viewer = await signedUp(t, 'viewer');
    await t.database.db.insert(teamMembers).values({ teamId, userId: viewer.user.id, role: 'viewer' });
    expect((await viewer.c.get(`/api/teams/${teamId}/studies/${study.id}/candidates.csv`)).status).toBe(200);
    const stranger = await signedUp(t, 'stranger');
    expect((await stranger.c.get(`/api/teams/${teamId}/studies/${study.id}/candidates.csv`)).status).toBe(404);
    expect((await owner.c.get(`/api/teams/${teamId}/studies/nope/candidates.csv`)).status).toBe(404);
  });
});

describe('a family member of a compressor map', () => {
  it('is saved to the team library as an estimate with its parent and rule, and ranked as one', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const res = await owner.c.post(`/api/teams/${teamId}/maps/builtin-compressor-m58/family`, {
      name: 'M58 scaled 1.1',
      rule: { kind: 'diameter', diameterRatio: 1.1, sizeEffect: true },
    });
    expect(res.status).toBe(201);
    expect(res.body.map.map.estimate).toMatchObject({ parentId: 'builtin-compressor-m58', parentName: 'Spoolbook demo compressor M58' });
    expect(res.body.map.notes).toMatch(/^Estimate: made from/);
    const list = await owner.c.get(`/api/teams/${teamId}/candidate-maps?kind=compressor`);
    expect(list.body.maps.find((m: { id: string }) => m.id === res.body.map.id).origin).toBe('estimate');
    const [, ...rows] = csvOf((await owner.c.get(`/api/teams/${teamId}/studies/${study.id}/candidates.csv`)).text);
    expect(rows.map((r) => r[0])).toContain('M58 scaled 1.1');
  });

  it('refuses a rule outside its honest range, and saves nothing', async () => {
    const { owner, teamId } = await teamWithStudy(t);
    const res = await owner.c.post(`/api/teams/${teamId}/maps/builtin-compressor-m58/family`, {
      name: 'Too far',
      rule: { kind: 'trim', parentTrim: 50, trim: 60 },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/within ±10 %/);
    const list = await owner.c.get(`/api/teams/${teamId}/candidate-maps?kind=compressor`);
    expect(list.body.maps.some((m: { name: string }) => m.name === 'Too far')).toBe(false);
  });

  it('refuses a turbine parent and a viewer', async () => {
    const { owner, teamId } = await teamWithStudy(t);
    const body = { name: 'x', rule: { kind: 'diameter', diameterRatio: 1.1 } };
    expect((await owner.c.post(`/api/teams/${teamId}/maps/builtin-turbine-t64-ar064-single/family`, body)).status).toBe(400);
    const viewer = await signedUp(t, 'viewer');
    await t.database.db.insert(teamMembers).values({ teamId, userId: viewer.user.id, role: 'viewer' });
    expect((await viewer.c.post(`/api/teams/${teamId}/maps/builtin-compressor-m58/family`, body)).status).toBe(403);
  });
});
