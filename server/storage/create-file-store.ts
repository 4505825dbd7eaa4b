import { resolve } from 'node:path';
import type { Env } from '../env';
import type { FileStore } from './file-store';
import { LocalDiskStore } from './local-disk-store';
import type { S3StoreOptions } from './s3-store';

/**
 * The S3 driver, loaded on first use: the AWS SDK takes longer to load than the rest of the server together,
 * and a server on local disk never needs it.
 */
function lazyS3Store(options: S3StoreOptions): FileStore {
  let store: Promise<FileStore> | null = null;
  const load = () => (store ??= import('./s3-store').then(({ S3Store }) => new S3Store(options)));
  return {
    driver: 's3',
    put: async (key, body, contentType) => (await load()).put(key, body, contentType),
    get: async (key) => (await load()).get(key),
    open: async (key) => (await load()).open(key),
    exists: async (key) => (await load()).exists(key),
    delete: async (key) => (await load()).delete(key),
  };
}

/** The file store the environment asks for: local disk unless STORAGE_DRIVER=s3. */
export function createFileStore(env: Env): FileStore {
  if (env.STORAGE_DRIVER === 's3') {
    return lazyS3Store({
      endpoint: env.S3_ENDPOINT || undefined,
      region: env.S3_REGION,
      bucket: env.S3_BUCKET!,
      accessKeyId: env.S3_ACCESS_KEY_ID!,
      secretAccessKey: env.S3_SECRET_ACCESS_KEY!,
      forcePathStyle: env.S3_FORCE_PATH_STYLE,
      prefix: env.S3_PREFIX || undefined,
    });
  }
  // Relative to the working directory: npm start, npm test and the CLI all run from the project root.
  return new LocalDiskStore(resolve(env.UPLOADS_DIR));
}
