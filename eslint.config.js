// The project's lint rules. Besides the usual TypeScript and React hook checks, the import rules
// encode the architecture (DEVELOPERS.md): shared/ imports nothing from src/ or server/; a feature
// reaches another feature only through its api/index.ts; components/ and lib/ import no feature;
// server routes never touch the database schema (services own every query); no import cycles.
import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import { importX } from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const SOURCES = ['src/**/*.{ts,tsx}', 'server/**/*.ts', 'shared/**/*.ts', 'scripts/**/*.ts', 'tests/**/*.{ts,tsx}', '*.ts'];

// One zone per client feature: it may import itself, and other features only through their api/.
const FEATURES = readdirSync(new URL('./src/features', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);
const featureZones = FEATURES.map((feature) => ({
  target: `./src/features/${feature}`,
  from: './src/features',
  except: [`./${feature}`, ...FEATURES.filter((f) => f !== feature).map((f) => `./${f}/api`)],
  message: 'Import another feature only through its api/index.ts.',
}));

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'drizzle/**', 'test-results/**', '.data/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    // Hooks live in the client only (elsewhere a `use…` name is no hook: psychrolib's useSi).
    files: ['src/**/*.{ts,tsx}', 'tests/unit/client/**/*.tsx'],
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    files: ['**/*.{js,mjs}'],
    languageOptions: { globals: globals.node },
  },
  {
    files: SOURCES,
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    plugins: { 'import-x': importX },
    settings: { 'import-x/resolver-next': [createTypeScriptImportResolver({ project: 'tsconfig.json' })] },
    rules: {
      // Control characters are matched on purpose: untrusted text (map files, mail, names) is cleaned of them.
      'no-control-regex': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-self-import': 'error',
      'import-x/no-duplicates': 'error',
      // Deep relative paths hide which layer a file reaches into: cross-layer imports use the
      // #shared/, #server/, #src/ and #tests/ aliases; inside a layer, at most one level up.
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['../../*'], message: 'Use a #shared/, #server/, #src/ or #tests/ alias instead of climbing more than one folder.' }] },
      ],
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: [
            {
              target: './shared',
              from: ['./src', './server', './tests', './scripts'],
              message: 'shared/ is pure: it imports nothing from the client, the server or the tests.',
            },
            { target: './src', from: ['./server'], message: 'The client reaches the server only over HTTP (src/lib/api-client.ts).' },
            { target: './server', from: ['./src'], message: 'The server never imports the client.' },
            { target: './server/routes', from: ['./server/db/schema.ts'], message: 'Routes are thin: they call a service, which owns every query.' },
            {
              target: ['./src/components', './src/lib'],
              from: ['./src/features', './src/routes'],
              message: 'Shared UI and client helpers import no feature and no page.',
            },
            ...featureZones,
          ],
        },
      ],
    },
  },
);
