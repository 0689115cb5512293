// `npm test`: install what is missing, then the same set-up with a fresh test database and every suite.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies, runTs } from './lib/deps.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
ensureDependencies(root);
runTs(root, 'scripts/run-tests.ts', process.argv.slice(2));
