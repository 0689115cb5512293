import { readFileSync, readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import { expect } from 'vitest';
import { parseMapFile } from '#shared/maps';
import type { CompressorMap, SpoolbookMap, TurbineMap } from '#shared/maps/types';

export const repoRoot = fileURLToPath(new URL('../../../', import.meta.url));
export const badFixtures = path.join(repoRoot, 'tests/fixtures/maps/bad');
export const goodFixtures = path.join(repoRoot, 'tests/fixtures/maps/good');
export const demoMapsFolder = path.join(repoRoot, 'data/maps');

/** |actual − expected| ≤ relTol·|expected| (or ≤ relTol when expected is 0). */
export function expectClose(actual: number | null | undefined, expected: number, relTol: number): void {
  expect(actual).not.toBeNull();
  expect(actual).not.toBeUndefined();
  const scale = expected === 0 ? 1 : Math.abs(expected);
  const error = Math.abs((actual as number) - expected) / scale;
  if (!(error <= relTol)) {
    throw new Error(`expected ${actual} to be within ${relTol} (relative) of ${expected}; relative error ${error}`);
  }
}

export function readBytes(file: string): Uint8Array {
  return new Uint8Array(readFileSync(file));
}

export function parseOk(input: string | Uint8Array): SpoolbookMap {
  const result = parseMapFile(input);
  if (!result.ok) throw new Error(`expected the file to read; got:\n${result.problems.map((p) => `line ${p.line} col ${p.column}: ${p.message}`).join('\n')}`);
  return result.map;
}

export function compressorOf(map: SpoolbookMap): CompressorMap {
  if (map.kind !== 'compressor') throw new Error('expected a compressor map');
  return map;
}

export function turbineOf(map: SpoolbookMap): TurbineMap {
  if (map.kind !== 'turbine') throw new Error('expected a turbine map');
  return map;
}

export function demoMapFiles(): string[] {
  return readdirSync(demoMapsFolder)
    .filter((f) => f.endsWith('.csv'))
    .sort();
}
