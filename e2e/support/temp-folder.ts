import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { test } from '@playwright/test';

/** A folder of the spec's own for the files it writes: made before its tests, removed after them. Its path. */
export function specFolder(prefix: string): () => string {
  let folder = '';
  test.beforeAll(async () => {
    folder = await mkdtemp(path.join(tmpdir(), prefix));
  });
  test.afterAll(async () => {
    await rm(folder, { recursive: true, force: true });
  });
  return () => folder;
}

/** Writes `content` as the file `name` in `folder`; the file's path. */
export async function writeInto(folder: string, name: string, content: string | Buffer): Promise<string> {
  const file = path.join(folder, name);
  await writeFile(file, content);
  return file;
}
