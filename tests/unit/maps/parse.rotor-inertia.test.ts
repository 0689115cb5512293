import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { planSpools } from '#shared/drive/spool';
import { parseMapFile, writeMapFile } from '#shared/maps';
import { compressorMapSchema } from '#shared/schemas/map';
import { computed, demoDriveDocument } from '../drive/helpers';
import { expectClose } from '../expect-close';
import { compressorOf, demoMapsFolder, parseOk } from './helpers';

/** The demo M58 file with one header line added after `# max speed`. */
function withLine(line: string): string {
  const text = readFileSync(path.join(demoMapsFolder, 'compressor-m58.csv'), 'utf8');
  return text.replace(/(# max speed: [^\n]*\n)/, `$1${line}\n`);
}

describe('the optional rotor inertia of a compressor file', () => {
  it('reads in any unit of mass times area, and writes back to the same value', () => {
    // 320 g·cm² = 0.320 kg · 1e-4 m² = 3.2e-5 kg·m² (unit definitions; mathjs converts).
    const map = compressorOf(parseOk(withLine('# rotor inertia: 320 g cm^2')));
    expectClose(map.rotorInertia, 3.2e-5, 1e-12, { what: 'rotor inertia' });
    expect(compressorMapSchema.safeParse(map).success).toBe(true);
    const again = compressorOf(parseOk(writeMapFile(map)));
    expectClose(again.rotorInertia, 3.2e-5, 1e-12, { what: 'written and read again' });
    expect(compressorOf(parseOk(withLine(''))).rotorInertia).toBeUndefined();
  });

  it('refuses a unit of another kind and an impossible value, by line', () => {
    const wrongKind = parseMapFile(withLine('# rotor inertia: 5 kPa'));
    expect(wrongKind.ok).toBe(false);
    if (!wrongKind.ok) expect(wrongKind.problems[0]).toMatchObject({ line: 9, message: expect.stringMatching(/"kPa" is not a unit of moment of inertia/) });
    const huge = parseMapFile(withLine('# rotor inertia: 2 kg m^2'));
    expect(!huge.ok && huge.problems[0].message).toBe('rotor inertia 2 kg m^2 must be above 0 and at most 0.01 kg m^2');
  });

  it('is the inertia the time to boost uses when the study gives none', () => {
    const doc = demoDriveDocument('turbineHousing', { rotors: undefined });
    const { result, models } = computed(doc);
    const [single] = planSpools(doc, result, { ...models, mapInertias: [4e-5, null] });
    expect(single.inertiaFrom).toBe('map');
    expect(single.inertia).toBe(4e-5);
  });
});
