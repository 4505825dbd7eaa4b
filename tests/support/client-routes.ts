import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';

/**
 * The staff app's page addresses, read from the route table in src/app/router.tsx (its `path:` entries and the
 * index page), so tests that visit every page cover a new page as soon as it is added there.
 * Patterns keep their parameters (`/catalog/:productId`); `*` is the not-found page.
 */
export function clientRoutePatterns(): string[] {
  const source = readFileSync(resolve(import.meta.dirname, '..', '..', 'src', 'app', 'router.tsx'), 'utf8');
  const paths = [...source.matchAll(/\bpath:\s*'([^']+)'/g)].map((match) => `/${match[1]}`);
  const withIndex = /\bindex:\s*true\b/.test(source) ? ['/', ...paths] : paths;
  return [...new Set(withIndex)];
}
