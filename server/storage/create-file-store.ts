import { resolve } from 'node:path';
import type { Env } from '../env';
import type { FileStore } from './file-store';
import { LocalDiskStore } from './local-disk-store';
import { S3Store } from './s3-store';

/** The file store the environment asks for: local disk unless STORAGE_DRIVER=s3. */
export function createFileStore(env: Env): FileStore {
  if (env.STORAGE_DRIVER === 's3') {
    return new S3Store({
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
