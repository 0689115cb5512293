import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ORIGIN, startTestApp, teamWithStudy, type TestApp } from './helpers';

const dir = path.resolve(import.meta.dirname, '..', 'fixtures', 'logs', 'bad');
interface Column {
  column: string;
  quantity: string;
  unit: string;
  reference?: string;
}
interface Case {
  file: string;
  expect: string;
  add?: Column[];
  remove?: string[];
  replace?: Record<string, Column>;
  rawMapping?: string;
  line?: number;
  column?: number;
}
const manifest = JSON.parse(readFileSync(path.join(dir, 'manifest.json'), 'utf8')) as { base: Column[]; cases: Case[] };

let t: TestApp;
let owner: Awaited<ReturnType<typeof teamWithStudy>>;
beforeAll(async () => {
  t = await startTestApp();
  owner = await teamWithStudy(t);
});
afterAll(async () => {
  await t.close();
});

function mappingOf(c: Case): string {
  if (c.rawMapping !== undefined) return c.rawMapping;
  const columns = manifest.base.filter((b) => !c.remove?.includes(b.column)).map((b) => c.replace?.[b.column] ?? b);
  return JSON.stringify({ columns: [...columns, ...(c.add ?? [])] });
}

describe('the bad-log corpus', () => {
  it('has at least 20 files, each in the manifest', () => {
    const files = readdirSync(dir).filter((f) => f.endsWith('.csv'));
    // The issue asks for a corpus of at least 20 bad logs.
    expect(files.length).toBeGreaterThanOrEqual(20);
    expect(manifest.cases.map((c) => c.file).sort()).toEqual(files.sort());
  });

  for (const c of manifest.cases) {
    it(`refuses ${c.file} with its message and stores nothing`, async () => {
      const { c: client } = owner.owner;
      const url = `/api/teams/${owner.teamId}/studies/${owner.study.id}/logs`;
      const before = (await client.get(url)).body.logs;
      const res = await client.agent
        .post(url)
        .set('Origin', ORIGIN)
        .field('mapping', mappingOf(c))
        .attach('file', readFileSync(path.join(dir, c.file)), c.file);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      const text = [
        res.body.error.message,
        ...(res.body.error.details?.problems ?? []).map((p: { message: string }) => p.message),
        ...(res.body.error.details?.issues ?? []).map((i: { message: string }) => i.message),
      ].join(' | ');
      expect(text).toMatch(new RegExp(c.expect, 'i'));
      if (c.line !== undefined) expect(res.body.error.details.problems[0]).toMatchObject({ line: c.line, column: c.column });
      expect((await client.get(url)).body.logs).toEqual(before);
    });
  }
});
