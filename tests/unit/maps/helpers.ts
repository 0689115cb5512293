import { readFileSync, readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import { parseMapFile } from '#shared/maps';
import type { CompressorMap, SpoolbookMap, TurbineMap } from '#shared/maps/types';

export const repoRoot = fileURLToPath(new URL('../../../', import.meta.url));
export const badFixtures = path.join(repoRoot, 'tests/fixtures/maps/bad');
export const goodFixtures = path.join(repoRoot, 'tests/fixtures/maps/good');
export const demoMapsFolder = path.join(repoRoot, 'data/maps');

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

function demoMap(file: string) {
  const parsed = parseMapFile(readFileSync(path.join(demoMapsFolder, `${file}.csv`), 'utf8'));
  if (!parsed.ok) throw new Error(`demo map ${file} did not read`);
  return parsed.map;
}

/** One of the invented demo turbine maps of data/maps. */
export function demoTurbine(name: 'ar064-single' | 'ar064-divided' | 'ar082-single' | 'ar082-divided'): TurbineMap {
  const map = demoMap(`turbine-t64-${name}`);
  if (map.kind !== 'turbine') throw new Error('not a turbine map');
  return map;
}

/** One of the invented demo compressor maps of data/maps. */
export function demoCompressor(name: 's44' | 'm58' | 'l76'): CompressorMap {
  const map = demoMap(`compressor-${name}`);
  if (map.kind !== 'compressor') throw new Error('not a compressor map');
  return map;
}

/** A turbine map with every flow parameter scaled (a bigger or smaller housing of the same invented wheel). */
export function scaledTurbine(map: TurbineMap, factor: number, change: Partial<Pick<TurbineMap, 'housing' | 'scrollFeed' | 'name'>> = {}): TurbineMap {
  return {
    ...map,
    ...change,
    curves: map.curves.map((c) => ({ ...c, points: c.points.map((p) => ({ ...p, flowParameter: p.flowParameter * factor })) })),
  };
}
