import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';
import { studyDocumentSchema } from '#shared/schemas/study';
import { runStudyDocument } from '#shared/study/run';

// Every number of the demo studies, one at a time, set to the smallest positive double, a tiny
// value and the largest double: the study schema refuses it by field, or the engine computes
// finite numbers only. (A rated injector pressure of 5e-324 Pa once scaled the injector flow to
// infinity.) The extremes are IEEE 754 double limits.

const root = path.resolve(import.meta.dirname, '../../..');
const maps: Record<string, SpoolbookMap> = {};
for (const file of ['compressor-s44', 'compressor-m58', 'compressor-l76', 'turbine-t64-ar064-single', 'turbine-t64-ar082-divided']) {
  const parsed = parseMapFile(readFileSync(path.join(root, 'data', 'maps', `${file}.csv`), 'utf8'));
  if (!parsed.ok) throw new Error(`${file} does not parse`);
  maps[`builtin-${file}`] = parsed.map;
}

type Key = string | number;
function numberPaths(value: unknown, at: Key[] = [], out: Key[][] = []): Key[][] {
  if (typeof value === 'number') out.push(at);
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) numberPaths(v, [...at, Array.isArray(value) ? Number(k) : k], out);
  return out;
}
function notFinite(value: unknown, at = '', out: string[] = []): string[] {
  if (typeof value === 'number' && !Number.isFinite(value)) out.push(at);
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) notFinite(v, `${at}.${k}`, out);
  return out;
}

describe('extreme numbers in a study document', () => {
  for (const file of ['hillclimb-study.json', 'turbine-housing-study.json']) {
    it(`${file}: each number at 5e-324, 1e-300 or the largest double is refused or computes to finite numbers`, () => {
      const base = JSON.parse(readFileSync(path.join(root, 'data', 'demo', file), 'utf8')) as Record<string, unknown>;
      const paths = numberPaths(base);
      expect(paths.length).toBeGreaterThan(50); // the demo documents are full studies
      const problems: string[] = [];
      let computed = 0;
      for (const extreme of [Number.MIN_VALUE, 1e-300, Number.MAX_VALUE]) {
        for (const p of paths) {
          const doc = structuredClone(base);
          let at = doc as Record<Key, unknown>;
          for (const k of p.slice(0, -1)) at = at[k] as Record<Key, unknown>;
          at[p[p.length - 1]] = extreme;
          const parsed = studyDocumentSchema.safeParse(doc);
          if (!parsed.success) continue;
          computed++;
          const bad = notFinite(runStudyDocument(parsed.data, maps).lines.map((l) => l.points));
          if (bad.length) problems.push(`${p.join('.')} = ${extreme}: ${bad.slice(0, 3).join(', ')}`);
        }
      }
      expect(computed).toBeGreaterThan(0);
      expect(problems).toEqual([]);
    }, 60_000);
  }
});
