// The staff app's first-load JavaScript: the entry script and the chunks index.html preloads with it, each
// gzip-compressed at level 9 (what a static server sends). Chunks loaded later by route (the editor, the charts)
// are not counted. Dependency-free, so the build and the tests can both read it.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { gzipSync } from 'node:zlib';

/** Budget for the first load, in bytes of gzipped JS (issue 9: "under 250 KB"; KB = 1000 bytes). */
export const firstLoadBudgetBytes = 250_000;

export function firstLoadJs(clientDir) {
  const html = readFileSync(resolve(clientDir, 'index.html'), 'utf8');
  const files = new Set();
  for (const match of html.matchAll(/<script[^>]*type="module"[^>]*src="([^"]+)"/g)) files.add(match[1]);
  for (const match of html.matchAll(/<link[^>]*rel="modulepreload"[^>]*href="([^"]+)"/g)) files.add(match[1]);
  const chunks = [...files].map((file) => {
    const body = readFileSync(resolve(clientDir, `.${file.startsWith('/') ? file : `/${file}`}`));
    return { file, bytes: body.length, gzipBytes: gzipSync(body, { level: 9 }).length };
  });
  return { chunks, gzipBytes: chunks.reduce((sum, c) => sum + c.gzipBytes, 0) };
}
