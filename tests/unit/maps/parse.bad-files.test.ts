import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseMapFile } from '#shared/maps';
import type { MapProblem } from '#shared/maps/types';
import { badFixtures, readBytes } from './helpers';

interface Expected {
  code: string;
  line: number | null;
  column: number | null;
  message: string;
}
const expected = JSON.parse(readFileSync(path.join(badFixtures, 'expected.json'), 'utf8')) as {
  files: Record<string, Expected[]>;
  accepted: Record<string, { notes: Expected[] }>;
};

const VALID_HEAD = `# spoolbook-map: 1
# kind: compressor
# name: Generated compressor
# flow: corrected mass, kg/s
# reference temperature: 298 K
# reference pressure: 100 kPa
# efficiency: percent
curve,label,flow,pressure_ratio,efficiency,speed
`;

function manyRows(count: number, row: (i: number) => string): string {
  const parts: string[] = [VALID_HEAD];
  for (let i = 0; i < count; i++) parts.push(row(i));
  return parts.join('');
}

/** Files too large or too binary to commit: the test writes them. */
const generated: Record<string, () => Uint8Array> = {
  '(generated) binary-data.bin': () => Uint8Array.from({ length: 4096 }, (_, i) => (i * 73 + 11) % 256),
  '(generated) utf-16.csv': () => {
    const text = VALID_HEAD;
    const bytes = new Uint8Array(2 + text.length * 2);
    bytes[0] = 0xff;
    bytes[1] = 0xfe;
    for (let i = 0; i < text.length; i++) bytes[2 + 2 * i] = text.charCodeAt(i);
    return bytes;
  },
  '(generated) workbook.xlsx': () => Uint8Array.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00, 0x08, 0x00, 0x00, 0x00, 0x21, 0x00]),
  '(generated) 200000-rows.csv': () => new TextEncoder().encode(manyRows(200_000, (i) => `speed,100000,${(0.01 + i * 1e-6).toFixed(6)},1.500,70,100000\n`)),
  '(generated) 60000-rows-under-2-MB.csv': () => new TextEncoder().encode(manyRows(60_000, (i) => `speed,1,${i + 1},1.5,70,1\n`)),
};

function sameProblem(found: MapProblem, wanted: Expected): boolean {
  return found.code === wanted.code && found.line === wanted.line && found.column === wanted.column && found.message.includes(wanted.message);
}

describe('bad map files', () => {
  const committed = readdirSync(badFixtures).filter((f) => f !== 'expected.json');

  it('has at least 30 committed bad files, each listed in expected.json', () => {
    const refused = committed.filter((f) => f in expected.files);
    expect(refused.length).toBeGreaterThanOrEqual(30); // the issue asks for a corpus of at least 30
    for (const file of committed) expect(file in expected.files || file in expected.accepted, `${file} is not in expected.json`).toBe(true);
    for (const file of Object.keys(expected.files)) {
      if (!file.startsWith('(generated)')) expect(committed, `${file} is in expected.json but not in the folder`).toContain(file);
    }
  });

  for (const [file, wanted] of Object.entries(expected.files)) {
    it(`refuses ${file} with its problems, and only those`, () => {
      const input = file.startsWith('(generated)') ? generated[file]() : readBytes(path.join(badFixtures, file));
      const result = parseMapFile(input);
      expect(result.ok).toBe(false);
      if (result.ok) return;
      for (const want of wanted) {
        expect(
          result.problems.some((p) => sameProblem(p, want)),
          `${file}: no problem ${JSON.stringify(want)} in ${JSON.stringify(result.problems, null, 1)}`,
        ).toBe(true);
      }
      expect(result.problems).toHaveLength(wanted.length);
      for (const p of result.problems) {
        expect(p.message.length).toBeGreaterThan(10); // a sentence in words, not a bare code (common practice, no source)
        expect(p.message).not.toMatch(/NaN|undefined|\[object/);
      }
    });
  }

  it('every generated case is in expected.json', () => {
    for (const key of Object.keys(generated)) expect(expected.files).toHaveProperty([key]);
  });

  for (const [file, { notes }] of Object.entries(expected.accepted)) {
    it(`accepts ${file} and says what it adjusted`, () => {
      const result = parseMapFile(readBytes(path.join(badFixtures, file)));
      expect(result.ok).toBe(true);
      if (!result.ok) return;
      expect(result.notes).toHaveLength(notes.length);
      for (const want of notes) expect(result.notes.some((n) => sameProblem(n, want))).toBe(true);
      const island = result.map.curves.find((c) => c.kind === 'island')!;
      // closed: the first point is repeated at the end
      expect(island.points[island.points.length - 1]).toEqual(island.points[0]);
    });
  }

  it('reads the same problems from the bytes and from the text of a file', () => {
    for (const file of committed.filter((f) => f in expected.files)) {
      const bytes = readBytes(path.join(badFixtures, file));
      expect(parseMapFile(new TextDecoder().decode(bytes))).toEqual(parseMapFile(bytes));
    }
  });

  it('lists at most 100 problems and says how many more there were', () => {
    const rows = manyRows(300, (i) => `speed,${i},abc,1.5,70,100000\n`);
    const result = parseMapFile(rows);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems).toHaveLength(101); // MAX_REPORTED_PROBLEMS (100) plus the "and N more" line
    expect(result.problems[100].message).toContain('and 200 more problems'); // 300 unreadable rows − 100 listed
  });
});
