import { mkdtemp, readdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import S3rver from 's3rver';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assertValidKey, type FileStore } from '../../../server/storage/file-store';
import { LocalDiskStore } from '../../../server/storage/local-disk-store';
import { S3Store } from '../../../server/storage/s3-store';

/** The one contract every driver keeps; run against local disk and, as a smoke test, a local S3-compatible fake. */
function fileStoreContract(name: string, makeStore: () => FileStore) {
  describe(`${name} file store`, () => {
    it('when a file is stored, then the same bytes come back by get and by stream', async () => {
      const store = makeStore();
      const body = Buffer.from([0, 1, 2, 250, 251, 252, 13, 10, 0x1a]);
      await store.put('runs/1/log.csv', body, 'text/csv');
      expect(await store.exists('runs/1/log.csv')).toBe(true);
      expect((await store.get('runs/1/log.csv'))?.equals(body)).toBe(true);
      const stream = await store.open('runs/1/log.csv');
      const chunks: Buffer[] = [];
      for await (const chunk of stream!) chunks.push(Buffer.from(chunk as Uint8Array));
      expect(Buffer.concat(chunks).equals(body)).toBe(true);
    });

    it('when a key does not exist, then get and open answer null and delete does not fail', async () => {
      const store = makeStore();
      expect(await store.get('runs/none/log.csv')).toBeNull();
      expect(await store.open('runs/none/log.csv')).toBeNull();
      expect(await store.exists('runs/none/log.csv')).toBe(false);
      await expect(store.delete('runs/none/log.csv')).resolves.toBeUndefined();
    });

    it('when a file is deleted, then it is gone', async () => {
      const store = makeStore();
      await store.put('photos/2/960.webp', Buffer.from('x'), 'image/webp');
      await store.delete('photos/2/960.webp');
      expect(await store.exists('photos/2/960.webp')).toBe(false);
    });

    it('when a key tries to leave the storage root, then it is refused before any I/O', async () => {
      const store = makeStore();
      for (const key of ['../etc/passwd', '/abs', 'a/../../b', 'a\\b', 'A/upper', '', 'a//b', 'a/./b']) {
        await expect(store.put(key, Buffer.from('x'), 'text/plain')).rejects.toThrow(/Invalid storage key/);
      }
    });
  });
}

let localRoot: string;
let s3Root: string;
let s3rver: S3rver;
let s3Port = 0;

beforeAll(async () => {
  localRoot = await mkdtemp(join(tmpdir(), 'benchwire-store-'));
  s3Root = await mkdtemp(join(tmpdir(), 'benchwire-s3-'));
  s3rver = new S3rver({
    address: '127.0.0.1',
    port: 0,
    silent: true,
    directory: s3Root,
    configureBuckets: [{ name: 'benchwire-test' }],
  });
  s3Port = (await s3rver.run()).port;
});

afterAll(async () => {
  await s3rver?.close();
  await rm(localRoot, { recursive: true, force: true });
  await rm(s3Root, { recursive: true, force: true });
});

fileStoreContract('local disk', () => new LocalDiskStore(localRoot));
fileStoreContract(
  'S3-compatible',
  () =>
    new S3Store({
      endpoint: `http://127.0.0.1:${s3Port}`,
      region: 'us-east-1',
      bucket: 'benchwire-test',
      // s3rver's documented default credentials for its local fake.
      accessKeyId: 'S3RVER',
      secretAccessKey: 'S3RVER',
      forcePathStyle: true,
      prefix: 'contract/',
    }),
);

describe('local disk writes', () => {
  it('when a write completes, then no temporary file is left beside it', async () => {
    const store = new LocalDiskStore(localRoot);
    await store.put('runs/9/log.csv', Buffer.alloc(64 * 1024, 7), 'text/csv');
    expect(await readdir(join(localRoot, 'runs', '9'))).toEqual(['log.csv']);
  });

  it('when keys are checked, then plain segment keys pass', () => {
    expect(() => assertValidKey('runs/12/3f9a.csv')).not.toThrow();
    expect(() => assertValidKey('photos/7/1920.jpg')).not.toThrow();
  });
});
