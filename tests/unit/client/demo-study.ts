import { readFileSync } from 'node:fs';
import path from 'node:path';
import { parseMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';

// The demo "which compressor?" study and its three built-in compressor maps, read from data/ as
// the server reads them, for the client tests that run the engine on real inputs.

const root = path.resolve(import.meta.dirname, '../../..');

/** The demo study document as stored (data/demo/hillclimb-study.json), not yet parsed. */
export function demoDocument(): Record<string, unknown> {
  return JSON.parse(readFileSync(path.join(root, 'data/demo/hillclimb-study.json'), 'utf8')) as Record<string, unknown>;
}

/** The built-in compressor maps the demo plans name, by id. */
export function demoMaps(): Record<string, SpoolbookMap> {
  const maps: Record<string, SpoolbookMap> = {};
  for (const name of ['s44', 'm58', 'l76']) {
    const parsed = parseMapFile(readFileSync(path.join(root, `data/maps/compressor-${name}.csv`), 'utf8'));
    if (!parsed.ok) throw new Error(`demo map ${name} does not parse`);
    maps[`builtin-compressor-${name}`] = parsed.map;
  }
  return maps;
}
