import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { MAX_MAP_DATA_ROWS, MAX_MAP_FILE_BYTES, parseMapFile } from '#shared/maps';
import type { MapProblemCode } from '#shared/maps/types';
import { repoRoot } from '../maps/helpers';

const docs = readFileSync(path.join(repoRoot, 'docs/map-format.md'), 'utf8');

/** The annotated examples: fenced blocks that are map files, with the "← …" notes taken off. */
function examples(): string[] {
  return [...docs.matchAll(/```\n(# spoolbook-map: 1[^\n]*\n[\s\S]*?)```/g)].map((m) => m[1].replace(/\s*←.*$/gm, ''));
}

describe('docs/map-format.md', () => {
  it('has annotated examples of a compressor and a turbine map that read as maps', () => {
    const found = examples();
    expect(found.length).toBeGreaterThanOrEqual(2);
    const kinds = found.map((text) => {
      const result = parseMapFile(text);
      expect(result.ok, JSON.stringify(!result.ok && result.problems)).toBe(true);
      return result.ok ? result.map.kind : null;
    });
    expect(kinds).toContain('compressor');
    expect(kinds).toContain('turbine');
  });

  it('lists every problem code the parser can give', () => {
    const codes: MapProblemCode[] = [
      'empty-file',
      'too-large',
      'too-many-rows',
      'not-text',
      'not-a-map-file',
      'header-syntax',
      'header-after-data',
      'unknown-key',
      'duplicate-key',
      'missing-key',
      'misplaced-key',
      'wrong-version',
      'unknown-kind',
      'bad-value',
      'missing-unit',
      'unknown-unit',
      'wrong-unit-kind',
      'formula-cell',
      'wrong-delimiter',
      'bad-columns',
      'column-count',
      'unclosed-quote',
      'decimal-comma',
      'unknown-curve',
      'not-a-number',
      'missing-value',
      'out-of-range',
      'pressure-ratio-below-one',
      'efficiency-out-of-range',
      'efficiency-scale',
      'too-few-points',
      'island-not-closed',
      'coincident-points-merged',
      'not-increasing',
      'duplicate-label',
      'inconsistent-line',
      'no-data-rows',
      'missing-curve',
    ];
    for (const code of codes) expect(docs, code).toContain(`| \`${code}\` |`);
  });

  it('states the limits the code enforces', () => {
    expect(MAX_MAP_FILE_BYTES).toBe(2 * 1024 * 1024); // "2 MB (2 MiB)" in the docs
    expect(MAX_MAP_DATA_ROWS).toBe(50_000);
    expect(docs).toContain('2 MB (2 MiB) and 50,000 data rows');
  });
});
