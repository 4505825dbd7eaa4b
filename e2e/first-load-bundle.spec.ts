import { resolve } from 'node:path';
import { expect, test } from '@playwright/test';
// @ts-expect-error -- a dependency-free script module without type declarations
import { firstLoadBudgetBytes, firstLoadJs } from '../scripts/lib/first-load-size.mjs';

// Reads the client the e2e step just built (dist/client): the first load stays within budget, and the editor
// library is not part of it (it loads with the write-up screens).
test('the staff app’s first load is under 250 KB of gzipped JS and carries no editor code', async () => {
  const result = firstLoadJs(resolve('dist', 'client')) as {
    chunks: { file: string; gzipBytes: number }[];
    gzipBytes: number;
  };
  console.log(`[bundle] first load: ${(result.gzipBytes / 1000).toFixed(1)} KB gzipped JS`);
  expect(result.chunks.length).toBeGreaterThan(0);
  expect(result.gzipBytes).toBeLessThan(firstLoadBudgetBytes);
  const { readFileSync } = await import('node:fs');
  for (const chunk of result.chunks) {
    const text = readFileSync(resolve('dist', 'client', `.${chunk.file}`), 'utf8');
    expect(text, chunk.file).not.toContain('ProseMirror');
  }
});
