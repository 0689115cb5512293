import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import { parseMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';

/** The invented demo maps shipped in data/maps/, offered read-only to every team. */
export interface BuiltinMap {
  id: string;
  fileName: string;
  fileText: string;
  map: SpoolbookMap;
}

const folder = fileURLToPath(new URL('../../data/maps', import.meta.url));
let cache: BuiltinMap[] | null = null;

export const BUILTIN_PREFIX = 'builtin-';

export function builtinMaps(): BuiltinMap[] {
  if (cache) return cache;
  const found: BuiltinMap[] = [];
  for (const fileName of readdirSync(folder)
    .filter((f) => f.endsWith('.csv'))
    .sort()) {
    const fileText = readFileSync(path.join(folder, fileName), 'utf8');
    const result = parseMapFile(fileText);
    // A broken demo file is a bug in the generator; the maps tests catch it, the server skips it.
    if (!result.ok) continue;
    found.push({ id: BUILTIN_PREFIX + fileName.replace(/\.csv$/, ''), fileName, fileText, map: result.map });
  }
  cache = found;
  return found;
}

export function builtinMap(id: string): BuiltinMap | null {
  return builtinMaps().find((m) => m.id === id) ?? null;
}
