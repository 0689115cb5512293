// `npm start`: install what is missing, then set up the database and serve the app.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies, runTs } from './lib/deps.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
ensureDependencies(root);
runTs(root, 'scripts/start-app.ts', process.argv.slice(2));
