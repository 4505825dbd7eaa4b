import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';

/** The reader entries of the client build (vite.config.ts): a stylesheet and one small script. */
export const readerStylesheetEntry = 'src/public/reader.css';
export const readerScriptEntry = 'src/public/chart-island.ts';

export interface ReaderAssets {
  stylesheet: string | null;
  script: string | null;
}

/** Reads the built file names of the reader entries from Vite's manifest; nulls when there is no build. */
export function readerAssetsFrom(clientDir: string | undefined): ReaderAssets {
  const none = { stylesheet: null, script: null };
  if (!clientDir) return none;
  const manifestPath = resolve(clientDir, '.vite/manifest.json');
  if (!existsSync(manifestPath)) return none;
  const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as Record<string, { file: string; css?: string[] }>;
  const style = manifest[readerStylesheetEntry];
  const script = manifest[readerScriptEntry];
  return {
    stylesheet: style ? `/${style.file}` : script?.css?.[0] ? `/${script.css[0]}` : null,
    script: script ? `/${script.file}` : null,
  };
}
