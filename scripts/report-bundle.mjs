// Prints the staff app's first-load JavaScript (gzipped) from the client build in dist/client; run after
// `vite build` (npm run build does), or alone: npm run bench:bundle.
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { firstLoadBudgetBytes, firstLoadJs } from './lib/first-load-size.mjs';

const clientDir = resolve(fileURLToPath(new URL('..', import.meta.url)), 'dist', 'client');
const { chunks, gzipBytes } = firstLoadJs(clientDir);
const kb = (bytes) => `${(bytes / 1000).toFixed(1)} KB`;
for (const chunk of chunks) console.log(`[bundle] ${chunk.file}: ${kb(chunk.bytes)} raw, ${kb(chunk.gzipBytes)} gzip`);
console.log(
  `[bundle] first load: ${kb(gzipBytes)} of gzipped JS (budget ${kb(firstLoadBudgetBytes)})${gzipBytes > firstLoadBudgetBytes ? ' — OVER BUDGET' : ''}`,
);
