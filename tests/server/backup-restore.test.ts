import { createHash } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, mkdtemp, readFile, readdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { createApp } from '../../server/app';
import { createDataSource, initializeDataSource } from '../../server/data-source';
import { setUpDatabase } from '../../server/database-setup';
import { archiveName, createBackup, restoreBackup, RestoreRefused } from '../../server/lib/backup-archive';
import { demoAccounts } from '../../server/seed/demo-staff';
import { asBytes, TEST_HOST, TEST_ORIGIN, testEnv } from './support/test-app';
import { testDatabaseUrl } from './support/seeded-outlet';

/**
 * The demo outlet goes through `db:backup` and `db:restore` into a second, empty database and uploads folder:
 * every table has the same rows (count and CHECKSUM TABLE), every uploaded file the same bytes, and the restored
 * app answers the same reads and serves the same public pages (results page, board pages, feed) byte for byte.
 */

const sourceUrl = testDatabaseUrl('bk_src');
const restoredUrl = testDatabaseUrl('bk_dst');

let work: string;
let sourceUploads: string;
let restoredUploads: string;
let archive: string;
const dataSources: DataSource[] = [];

beforeAll(async () => {
  work = await mkdtemp(join(tmpdir(), 'benchwire-backup-test-'));
  sourceUploads = join(work, 'uploads-source');
  restoredUploads = join(work, 'uploads-restored');
  // The seed writes the demo's logger files through the file store the environment names.
  const uploadsBefore = process.env.UPLOADS_DIR;
  process.env.UPLOADS_DIR = sourceUploads;
  try {
    await setUpDatabase(sourceUrl, { fresh: true, seed: true, quiet: true });
  } finally {
    if (uploadsBefore === undefined) delete process.env.UPLOADS_DIR;
    else process.env.UPLOADS_DIR = uploadsBefore;
  }
  await setUpDatabase(restoredUrl, { drop: true });
}, 120_000);

afterAll(async () => {
  for (const dataSource of dataSources) await dataSource.destroy();
  await setUpDatabase(sourceUrl, { drop: true });
  await setUpDatabase(restoredUrl, { drop: true });
  await rm(work, { recursive: true, force: true });
});

async function open(url: string) {
  const dataSource = await initializeDataSource(createDataSource(url, { poolSize: 2 }));
  dataSources.push(dataSource);
  return dataSource;
}

/** Every table with its row count and CHECKSUM TABLE value. */
async function tableFingerprints(dataSource: DataSource) {
  const tables = (
    (await dataSource.query(
      "SELECT TABLE_NAME AS name FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_TYPE = 'BASE TABLE' ORDER BY TABLE_NAME",
    )) as { name: string }[]
  ).map((row) => row.name);
  const fingerprints: Record<string, { rows: number; checksum: string }> = {};
  for (const table of tables) {
    const [{ rows }] = await dataSource.query(`SELECT COUNT(*) AS \`rows\` FROM \`${table}\``);
    const [{ Checksum }] = await dataSource.query(`CHECKSUM TABLE \`${table}\` EXTENDED`);
    fingerprints[table] = { rows: Number(rows), checksum: String(Checksum) };
  }
  return fingerprints;
}

async function fileDigests(dir: string) {
  const digests: Record<string, string> = {};
  if (!existsSync(dir)) return digests;
  for (const entry of await readdir(dir, { recursive: true, withFileTypes: true })) {
    if (!entry.isFile()) continue;
    const path = join(entry.parentPath, entry.name);
    digests[relative(dir, path)] = createHash('sha256')
      .update(await readFile(path))
      .digest('hex');
  }
  return digests;
}

/** The app over the original outlet and the app over its restored copy, in that order. */
function originalAndRestoredApps() {
  return [
    createApp({ dataSource: dataSources[0], env: testEnv({ DATABASE_URL: sourceUrl, UPLOADS_DIR: sourceUploads }) }),
    createApp({
      dataSource: dataSources[1],
      env: testEnv({ DATABASE_URL: restoredUrl, UPLOADS_DIR: restoredUploads }),
    }),
  ];
}

describe('backup and restore', () => {
  it('names the archive by its date, sortable and free of characters shells mind', () => {
    expect(archiveName(new Date('2026-12-03T09:01:02.345Z'))).toBe('benchwire-backup-20261203T090102Z.tar.gz');
  });

  it('when the demo outlet is backed up and restored into an empty database, then every table and file is the same', async () => {
    const backup = await createBackup({ databaseUrl: sourceUrl, uploadsDir: sourceUploads, outDir: work });
    archive = backup.file;
    expect(archive).toMatch(/benchwire-backup-\d{8}T\d{6}Z\.tar\.gz$/);
    expect(backup.uploadFiles).toBeGreaterThan(0);

    const restored = await restoreBackup({ file: archive, databaseUrl: restoredUrl, uploadsDir: restoredUploads });
    const source = await tableFingerprints(await open(sourceUrl));
    const copy = await tableFingerprints(await open(restoredUrl));
    expect(restored.tables).toBe(Object.keys(source).length);
    // The demo has data in the tables that matter (a broken dump of empty tables would also compare equal).
    for (const table of ['users', 'products', 'roundups', 'matrix_cells', 'test_runs', 'stored_files']) {
      expect(source[table]?.rows, table).toBeGreaterThan(0);
    }
    expect(copy).toEqual(source);
    expect(await fileDigests(restoredUploads)).toEqual(await fileDigests(sourceUploads));
    expect(Object.keys(await fileDigests(sourceUploads))).toHaveLength(backup.uploadFiles);
  }, 120_000);

  it('the restored app answers the same reads, byte for byte, as the original', async () => {
    const apps = originalAndRestoredApps();
    const editor = demoAccounts.find((account) => account.role === 'editor')!;
    const answers: string[][] = [];
    for (const app of apps) {
      const agent = request.agent(app).set('Host', TEST_HOST).set('Origin', TEST_ORIGIN);
      const signIn = await agent.post('/api/auth/sign-in').send({ email: editor.email, password: editor.password });
      expect(signIn.status).toBe(200);
      const { roundups } = (await agent.get('/api/roundups')).body as { roundups: { id: number }[] };
      expect(roundups.length).toBeGreaterThan(0);
      const reads = [
        '/api/roundups',
        '/api/catalog/products',
        '/api/benches',
        '/api/dashboard',
        ...roundups.flatMap(({ id }) => [
          `/api/roundups/${id}`,
          `/api/roundups/${id}/matrix`,
          `/api/roundups/${id}/results`,
          `/api/roundups/${id}/history`,
        ]),
      ];
      const texts: string[] = [];
      for (const path of reads) {
        const response = await agent.get(path);
        expect(response.status, path).toBe(200);
        texts.push(response.text);
      }
      // A logger file kept as evidence comes back from the restored uploads folder.
      const [run] = await (apps.indexOf(app) === 0 ? dataSources[0] : dataSources[1]).query(
        'SELECT id FROM test_runs ORDER BY id LIMIT 1',
      );
      const file = await agent.get(`/api/runs/${run.id}/logger-file`).buffer(true);
      expect(file.status).toBe(200);
      texts.push(
        createHash('sha256')
          .update(file.body as Buffer)
          .digest('hex'),
      );
      answers.push(texts);
    }
    expect(answers[1]).toEqual(answers[0]);
  }, 60_000);

  it('the restored app serves the same public pages, byte for byte: the published results page and the board pages', async () => {
    const apps = originalAndRestoredApps();
    const [results] = (await dataSources[0].query(
      "SELECT path FROM published_pages WHERE roundup_id IS NOT NULL AND variant = '' ORDER BY path LIMIT 1",
    )) as { path: string }[];
    expect(results, 'the demo publishes a roundup').toBeTruthy();
    const get = (app: (typeof apps)[number], path: string) => asBytes(request(app).get(path).set('Host', TEST_HOST));
    // The board (product) pages the results page links to, rendered live from the restored rows.
    const resultsPage = (await get(apps[0], results.path)).body as Buffer;
    const boards = [...new Set(resultsPage.toString('utf8').match(/\/read\/products\/[a-z0-9-]+/g) ?? [])];
    expect(boards.length, 'the results page links to its boards').toBeGreaterThan(0);
    const paths = ['/read', results.path, ...boards, '/read/feed.atom'];
    const pages: Buffer[][] = [];
    for (const app of apps) {
      const bodies: Buffer[] = [];
      for (const path of paths) {
        const response = await get(app, path);
        expect(response.status, path).toBe(200);
        bodies.push(response.body as Buffer);
      }
      pages.push(bodies);
    }
    paths.forEach((path, n) => expect(pages[1][n].equals(pages[0][n]), `${path} is the same after restore`).toBe(true));
  }, 60_000);

  it('a database that already holds tables is refused, and nothing in it changes', async () => {
    const before = await tableFingerprints(dataSources[1]);
    const empty = join(work, 'uploads-empty');
    await expect(restoreBackup({ file: archive, databaseUrl: restoredUrl, uploadsDir: empty })).rejects.toThrow(
      RestoreRefused,
    );
    await expect(restoreBackup({ file: archive, databaseUrl: restoredUrl, uploadsDir: empty })).rejects.toThrow(
      /already holds \d+ tables/,
    );
    expect(await tableFingerprints(dataSources[1])).toEqual(before);
    expect(existsSync(empty)).toBe(false);
  });

  it('an uploads folder that holds files is refused before the database is touched', async () => {
    const third = testDatabaseUrl('bk_third');
    const busy = join(work, 'uploads-busy');
    await mkdir(busy, { recursive: true });
    await writeFile(join(busy, 'keep-me.txt'), 'already here');
    try {
      await expect(restoreBackup({ file: archive, databaseUrl: third, uploadsDir: busy })).rejects.toThrow(
        /uploads folder .* is not empty/,
      );
      expect(await readFile(join(busy, 'keep-me.txt'), 'utf8')).toBe('already here');
    } finally {
      await setUpDatabase(third, { drop: true });
    }
  });

  it('a file that is not a Benchwire backup is refused with a message', async () => {
    const notBackup = join(work, 'not-a-backup.tar.gz');
    await writeFile(notBackup, 'plain text, not an archive');
    await expect(
      restoreBackup({ file: notBackup, databaseUrl: testDatabaseUrl('bk_none'), uploadsDir: null }),
    ).rejects.toThrow(/tar failed|not a Benchwire backup/);
  });
});
