import { fileURLToPath } from 'node:url';

/**
 * The file of the worker thread entry `server/workers/<name>.ts`, for `new Piscina({ filename })`. Run from
 * source (tsx) it is that TypeScript file; in the built server every module but the workers sits directly in
 * dist/server, and vite.server.config.ts emits each worker as dist/server/workers/<name>.js beside it.
 */
export function workerFile(name: string): string {
  const extension = import.meta.url.endsWith('.ts') ? 'ts' : 'js';
  return fileURLToPath(new URL(`./workers/${name}.${extension}`, import.meta.url));
}
