import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseMapFile, writeMapFile } from '#shared/maps';
import type { TurbineMap } from '#shared/maps/types';
import { spoolbookMapSchema } from '#shared/schemas/map';
import { demoMapsFolder, goodFixtures, parseOk } from './helpers';

const turbineFile = readFileSync(path.join(goodFixtures, 'turbine-divided.csv'), 'utf8');
const withKind = (words: string) => turbineFile.replace('# efficiency:', `# efficiency kind: ${words}\n# efficiency:`);
const turbineOf = (text: string) => parseOk(text) as TurbineMap;

describe('the turbine map field saying what its efficiency counts', () => {
  it('reads the two kinds by their words, loosely as to case, spaces and hyphens', () => {
    expect(turbineOf(withKind('total-to-static, with bearing losses')).efficiencyKind).toBe('with-bearing-losses'); // docs/map-format.md
    expect(turbineOf(withKind('Total-to-Static,  with Bearing Losses')).efficiencyKind).toBe('with-bearing-losses');
    expect(turbineOf(withKind('aerodynamic only')).efficiencyKind).toBe('aerodynamic');
    expect(turbineOf(withKind('Aerodynamic-only')).efficiencyKind).toBe('aerodynamic');
    // Absent: the map says nothing, read as aerodynamic only by the engine (docs/physics.md).
    expect('efficiencyKind' in turbineOf(turbineFile)).toBe(false);
  });

  it('survives upload, download and upload: parse, write, parse', () => {
    for (const words of ['total-to-static, with bearing losses', 'aerodynamic only']) {
      const first = turbineOf(withKind(words));
      const written = writeMapFile(first);
      expect(written).toContain(`# efficiency kind: ${words}\n`); // written in the format's own words
      expect(parseOk(written)).toEqual(first);
      expect(writeMapFile(parseOk(written))).toBe(written); // a file Spoolbook wrote comes back byte for byte
    }
    // A file without the key is written without it.
    expect(writeMapFile(turbineOf(turbineFile))).not.toContain('efficiency kind');
  });

  it('refuses words it does not know, and the key on a compressor map', () => {
    const bad = parseMapFile(withKind('with the bearings'));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.problems.map((p) => p.code)).toEqual(['bad-value']);
    const compressor = readFileSync(path.join(goodFixtures, 'compressor-minimal.csv'), 'utf8').replace(
      '# efficiency:',
      '# efficiency kind: aerodynamic only\n# efficiency:',
    );
    const misplaced = parseMapFile(compressor);
    expect(misplaced.ok).toBe(false);
    if (!misplaced.ok) expect(misplaced.problems.map((p) => p.code)).toContain('misplaced-key');
  });

  it('is checked by the stored-map schema, and older stored maps without it still pass', () => {
    const map = turbineOf(withKind('aerodynamic only'));
    expect(spoolbookMapSchema.safeParse(map).success).toBe(true);
    expect(spoolbookMapSchema.safeParse({ ...map, efficiencyKind: 'shaft' }).success).toBe(false);
    const { efficiencyKind: _kind, ...older } = map;
    expect(spoolbookMapSchema.safeParse(older).success).toBe(true);
  });

  it('is stated by every demo turbine map', () => {
    for (const file of ['turbine-t64-ar064-single', 'turbine-t64-ar064-divided', 'turbine-t64-ar082-single', 'turbine-t64-ar082-divided']) {
      const map = turbineOf(readFileSync(path.join(demoMapsFolder, `${file}.csv`), 'utf8'));
      expect(map.efficiencyKind, file).toBe('with-bearing-losses'); // scripts/generate-demo-maps.ts: an invented bearing efficiency is in the figures
    }
  });
});
