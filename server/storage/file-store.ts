import type { Readable } from 'node:stream';

/**
 * Where Benchwire keeps uploaded files (logger files as evidence, photos and their web sizes): local disk under
 * `uploads/` by default, or S3-compatible object storage. Keys are made by the services, never from user input.
 */
export interface FileStore {
  /** Human-readable name of the driver, for logs and health output. */
  readonly driver: 'local' | 's3';
  /** Writes the whole object; an existing key is replaced. Either the whole body is stored or nothing. */
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  /** The object's bytes, or null when there is no such key. */
  get(key: string): Promise<Buffer | null>;
  /** A stream of the object's bytes, or null when there is no such key. */
  open(key: string): Promise<Readable | null>;
  exists(key: string): Promise<boolean>;
  /** Deleting a key that does not exist is not an error. */
  delete(key: string): Promise<void>;
}

const keyPattern = /^[a-z0-9][a-z0-9._-]*(\/[a-z0-9][a-z0-9._-]*)*$/;

/**
 * Keys are lower-case path segments of letters, digits, dot, dash and underscore: no `..`, no leading slash, no
 * backslash — so a key can never leave the storage root, whichever driver is used.
 */
export function assertValidKey(key: string): void {
  if (
    key.length > 512 ||
    !keyPattern.test(key) ||
    key.split('/').some((segment) => segment === '.' || segment === '..')
  ) {
    throw new Error(`Invalid storage key: ${JSON.stringify(key)}`);
  }
}
