// No module may reach itself through its imports. Type-only imports count too: `import type` still
// ties two modules' designs together. `npm run lint` runs this (`npm run lint:cycles` alone).
/** @type {import('dependency-cruiser').IConfiguration} */
export default {
  forbidden: [
    {
      name: 'no-circular',
      severity: 'error',
      comment: 'Modules that import each other, directly or through others: move what both need into a module of its own.',
      from: {},
      to: { circular: true },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
  },
};
