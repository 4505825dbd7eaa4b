import { randomBytes } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { mkdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import { dirname, join, resolve, sep } from 'node:path';
import type { Readable } from 'node:stream';
import { assertValidKey, type FileStore } from './file-store';
import { storageWriteError } from './storage-errors';

function isMissing(error: unknown) {
  return (error as NodeJS.ErrnoException)?.code === 'ENOENT';
}

/** Files under one folder (default `uploads/`). Writes go to a temporary name first and are renamed into place. */
export class LocalDiskStore implements FileStore {
  readonly driver = 'local' as const;
  private readonly root: string;

  constructor(root: string) {
    this.root = resolve(root);
  }

  private pathOf(key: string) {
    assertValidKey(key);
    const path = resolve(join(this.root, key));
    if (!path.startsWith(this.root + sep)) throw new Error(`Invalid storage key: ${JSON.stringify(key)}`);
    return path;
  }

  async put(key: string, body: Buffer, _contentType: string) {
    const path = this.pathOf(key);
    const temporary = `${path}.${randomBytes(6).toString('hex')}.partial`;
    try {
      await mkdir(dirname(path), { recursive: true });
      await writeFile(temporary, body, { flag: 'wx' });
      await rename(temporary, path);
    } catch (error) {
      // A full disk leaves a truncated temporary file: it goes, so nothing half-written stays behind.
      await rm(temporary, { force: true }).catch(() => undefined);
      throw storageWriteError(error, this.driver);
    }
  }

  async get(key: string) {
    try {
      return await readFile(this.pathOf(key));
    } catch (error) {
      if (isMissing(error)) return null;
      throw error;
    }
  }

  async open(key: string): Promise<Readable | null> {
    const path = this.pathOf(key);
    if (!(await this.exists(key))) return null;
    return createReadStream(path);
  }

  async exists(key: string) {
    try {
      return (await stat(this.pathOf(key))).isFile();
    } catch (error) {
      if (isMissing(error)) return false;
      throw error;
    }
  }

  async delete(key: string) {
    await rm(this.pathOf(key), { force: true });
  }
}
