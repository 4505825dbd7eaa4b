// The server, built once to plain JavaScript for `npm start` and the end-to-end tests (`npm run dev` and the
// API tests run the TypeScript through tsx and Vitest instead). Dependencies stay in node_modules; the server's
// own code, shared/ included, is bundled. TypeORM's decorators compile from tsconfig's experimentalDecorators
// (no decorator metadata: every column states its type), and entities and migrations are imported explicitly.
//
// Layout of dist/server: index.js (the app server), start-production.js (migrate and seed, then the app server,
// as `npm start` runs it) and setup-database.js (the command line) with their shared chunks all directly in the
// folder, and each worker thread's entry server/workers/<name>.ts as
// workers/<name>.js, so `new Piscina({ filename: workerFile('<name>') })` finds it (server/worker-file.ts).
import { existsSync, readdirSync } from 'node:fs';
import { defineConfig } from 'vite';

const workerEntries = existsSync('server/workers')
  ? Object.fromEntries(
      readdirSync('server/workers')
        .filter((file) => file.endsWith('.ts') && !file.endsWith('.d.ts'))
        .map((file) => [`workers/${file.slice(0, -3)}`, `server/workers/${file}`]),
    )
  : {};

export default defineConfig({
  publicDir: false,
  build: {
    ssr: true,
    target: 'node20',
    outDir: 'dist/server',
    emptyOutDir: true,
    sourcemap: true,
    copyPublicDir: false,
    rolldownOptions: {
      input: {
        index: 'server/index.ts',
        'start-production': 'server/start-production.ts',
        'setup-database': 'server/cli/setup-database.ts',
        'mail-relay': 'server/cli/mail-relay.ts',
        ...workerEntries,
      },
      output: {
        format: 'esm',
        entryFileNames: '[name].js',
        chunkFileNames: '[name]-[hash].js',
      },
    },
  },
});
