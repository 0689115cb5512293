// `npm run bench`: install what is missing, then run every benchmark and print its figures.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies, runTs } from './lib/deps.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
ensureDependencies(root);
runTs(root, 'scripts/run-bench.ts', process.argv.slice(2));
