// `npm run build` (second half): the server compiled to plain JavaScript in dist-server/, run by
// `node` alone (`npm run serve`) — no TypeScript runner in production. esbuild bundles each entry's
// own code (server/ and shared/, extensionless imports and the JSON it reads included) and leaves
// every npm package as an import, so dist-server needs the production dependencies only. Types
// are checked by `npm run typecheck`, not here. The demo seed is not among the entries.
import { build } from 'esbuild';
import { rmSync } from 'node:fs';

const outdir = 'dist-server';
rmSync(outdir, { recursive: true, force: true });
await build({
  entryPoints: {
    index: 'server/index.ts',
    migrate: 'server/db/migrate-cli.ts',
    'admin-create': 'server/admin-create-cli.ts',
    reindex: 'server/db/reindex-cli.ts',
  },
  outdir,
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  packages: 'external',
  sourcemap: true,
  chunkNames: 'chunks/[name]-[hash]',
  logLevel: 'warning',
});
console.log(`[build] server compiled to ${outdir}/ (index.js, migrate.js, admin-create.js, reindex.js)`);
