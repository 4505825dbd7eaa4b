import sharp from 'sharp';
import { execFileSync, spawnSync } from 'node:child_process';
import { chmodSync, closeSync, mkdirSync, mkdtempSync, openSync, readdirSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { AuditEntryEntity } from '../../../server/entities/audit-entry.entity';
import { PhotoEntity } from '../../../server/entities/photo.entity';
import { ProductEntity } from '../../../server/entities/product.entity';
import { StoredFileEntity } from '../../../server/entities/stored-file.entity';
import { TestRunEntity } from '../../../server/entities/test-run.entity';
import { syntheticLoggerLog } from '../../../shared/generators/synthetic-logger-log';
import { signedIn, testApp, testDataSource, type Client } from '../support/test-app';
import { bookedCell, tag } from '../planning/support/planning-fixtures';

/**
 * The uploads folder cannot be written (made read-only) or the disk is full: every upload route answers a JSON error
 * that says nothing was kept, leaves no row behind and no file (whole or partial) on disk, and works again as soon
 * as the folder does — without a restart. Routes that keep no file (catalog import, log check) go on working.
 */

const isRoot = process.getuid?.() === 0;
const cleanups: (() => void)[] = [];
afterAll(() => {
  for (const cleanup of cleanups.reverse()) {
    try {
      cleanup();
    } catch {
      // Best effort: the folder is under the system temp folder.
    }
  }
});

/** Regular files under the folder, at any depth (directories left by mkdir hold nothing). */
function filesUnder(dir: string): string[] {
  return readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((entry) => entry.isFile())
    .map((entry) => join(entry.parentPath, entry.name));
}

/** True when a new file can be created in the folder (root ignores permission bits, so this is checked, not assumed). */
function writable(dir: string): boolean {
  const probe = join(dir, `.probe-${process.pid}`);
  try {
    closeSync(openSync(probe, 'wx'));
    rmSync(probe);
    return true;
  } catch {
    return false;
  }
}

/**
 * Makes the folder read-only: mode 0555, and for root (whom permission bits do not stop) the immutable attribute as
 * well, which refuses new entries to every user (chattr(1)). Returns the function that makes it writable again.
 */
function makeReadOnly(dir: string): () => void {
  chmodSync(dir, 0o555);
  let immutable = false;
  if (isRoot) {
    execFileSync('chattr', ['+i', dir]);
    immutable = true;
  }
  const undo = () => {
    if (immutable) execFileSync('chattr', ['-i', dir]);
    immutable = false;
    chmodSync(dir, 0o755);
  };
  cleanups.push(undo);
  if (writable(dir)) throw new Error(`Could not make ${dir} read-only for this test.`);
  return undo;
}

/** A one-hour soak at 1 Hz (the same shape the capture tests upload). */
const soakLog = () =>
  Buffer.from(
    syntheticLoggerLog({
      durationS: 3600,
      sampleHz: 1,
      seed: 7,
      probes: [{ name: 'VRM 1', startC: 21, riseC: 50, tauS: 600, noiseC: 0.05 }],
      ambient: { name: 'Ambient', startC: 21, noiseC: 0.05 },
    }),
    'utf8',
  );
const mapping = { time: 'Time [s]', vrm: ['VRM 1 [°C]'], ambient: 'Ambient [°C]' };

const photo = () =>
  sharp({ create: { width: 640, height: 480, channels: 3, background: '#2a6f8f' } })
    .jpeg()
    .toBuffer();

async function setUp(uploadsDir: string) {
  const app = await testApp({ UPLOADS_DIR: uploadsDir });
  const editor = await signedIn(app, 'editor');
  const tester = await signedIn(app, 'tester');
  const { roundupId, entryId, cellId, startedAt } = await bookedCell(editor.agent, tester);
  return {
    editor,
    tester,
    roundupId,
    entryId,
    cellId,
    uploadPhoto: async (agent: Client) =>
      agent
        .post(`/api/roundups/${roundupId}/entries/${entryId}/photos`)
        .attach('file', await photo(), 'board.jpg')
        .field('kind', 'overview')
        .field('altText', 'The board seen from above'),
    uploadRun: (agent: Client) =>
      agent
        .post(`/api/cells/${cellId}/runs`)
        .attach('file', soakLog(), { filename: 'soak.csv', contentType: 'text/csv' })
        .field('request', JSON.stringify({ firmwareVersion: 'F1.2', startedAt, mapping })),
  };
}

/** Rows an upload to this roundup would add: photos, runs, stored logger files and their audit lines. */
async function rowsOf(roundupId: number, entryId: number, cellId: number) {
  const ds = await testDataSource();
  const storedFiles = await ds
    .getRepository(StoredFileEntity)
    .createQueryBuilder('file')
    .where('file.storage_key LIKE :prefix', { prefix: `runs/cell-${cellId}/%` })
    .getCount();
  return {
    photos: await ds.getRepository(PhotoEntity).countBy({ entryId }),
    runs: await ds.getRepository(TestRunEntity).countBy({ matrixCellId: cellId }),
    storedFiles,
    photoAudit: await ds
      .getRepository(AuditEntryEntity)
      .countBy({ action: 'photo.added', subjectId: String(roundupId) }),
  };
}

function expectStorageError(
  response: { status: number; body: { error?: { code?: string; message?: string } } },
  status: number,
  code: string,
) {
  expect(response.status, JSON.stringify(response.body)).toBe(status);
  expect(response.body.error?.code).toBe(code);
  expect(response.body.error?.message).toMatch(/nothing was saved/);
}

const catalogHeader =
  'maker,model,platform,socket,chipset,form_factor,release_date,vrm_controller,controller_phases,phase_multiplication,' +
  'stages_per_phase,vcore_stage_type,vcore_stage_part,vcore_stage_current_a,rear_usb_10g,lan_speed_mbps,wifi,m2_slots,' +
  'io_shield_prefitted,price_region,price_currency,price_amount,price_observed_on,price_source';

describe('an upload folder that cannot be written', () => {
  it('photo and logger uploads answer 503 storage_unavailable, keep no row and no file, and work again once it is writable', async () => {
    const uploadsDir = mkdtempSync(join(tmpdir(), 'benchwire-readonly-uploads-'));
    cleanups.push(() => rmSync(uploadsDir, { recursive: true, force: true }));
    const { editor, tester, roundupId, entryId, cellId, uploadPhoto, uploadRun } = await setUp(uploadsDir);
    const before = await rowsOf(roundupId, entryId, cellId);
    const makeWritable = makeReadOnly(uploadsDir);

    expectStorageError(await uploadPhoto(tester.agent), 503, 'storage_unavailable');
    expectStorageError(await uploadRun(tester.agent), 503, 'storage_unavailable');
    expect(await rowsOf(roundupId, entryId, cellId)).toEqual(before);
    expect(filesUnder(uploadsDir)).toEqual([]);

    // Uploads that keep no file are not stopped by the folder: the catalog import saves rows, the log check nothing.
    const maker = `Quillon ${tag()}`;
    const csv = [
      catalogHeader,
      `${maker},Q50 Steady,Helix-1700 ${tag()},HX4,HX-B50,atx,2025-02-10,KV-PWM8,8,doubled,1,integrated-power-stage,KVS-60,60,2,2500,wifi-6e,3,yes,DE,EUR,189.90,2025-06-01,Brightmoor Direct`,
    ].join('\n');
    const preview = await editor.agent
      .post('/api/catalog/import/preview')
      .attach('file', Buffer.from(csv), { filename: 'catalog.csv', contentType: 'text/csv' });
    expect(preview.status, preview.text).toBe(200);
    const commit = await editor.agent
      .post('/api/catalog/import/commit')
      .attach('file', Buffer.from(csv), { filename: 'catalog.csv', contentType: 'text/csv' })
      .field('checksum', preview.body.checksum);
    expect(commit.status, commit.text).toBe(200);
    expect(await (await testDataSource()).getRepository(ProductEntity).countBy({ maker })).toBe(1);
    const check = await tester.agent
      .post('/api/log-check/analyse')
      .attach('file', soakLog(), 'soak.csv')
      .field('request', JSON.stringify({ mapping }));
    expect(check.status, check.text).toBe(200);
    expect(filesUnder(uploadsDir)).toEqual([]);

    // The same app, not restarted, stores both once the folder can be written again.
    makeWritable();
    const photoAgain = await uploadPhoto(tester.agent);
    expect(photoAgain.status, photoAgain.text).toBe(201);
    const runAgain = await uploadRun(tester.agent);
    expect(runAgain.status, runAgain.text).toBe(201);
    const after = await rowsOf(roundupId, entryId, cellId);
    expect(after).toEqual({
      photos: before.photos + 1,
      runs: before.runs + 1,
      storedFiles: before.storedFiles + 1,
      photoAudit: before.photoAudit + 1,
    });
    expect(filesUnder(uploadsDir).filter((path) => path.endsWith('.partial'))).toEqual([]);
  });
});

/** A 1 MiB tmpfs needs mount(2) privileges (root outside a restricted container); without them the case is skipped. */
const canMount = isRoot && spawnSync('mount', ['--version']).status === 0;

describe.skipIf(!canMount)('a full disk under the upload folder', () => {
  it('photo and logger uploads answer 507 storage_full and leave no partial file and no row', async () => {
    const uploadsDir = mkdtempSync(join(tmpdir(), 'benchwire-full-uploads-'));
    cleanups.push(() => rmSync(uploadsDir, { recursive: true, force: true }));
    const { tester, roundupId, entryId, cellId, uploadPhoto, uploadRun } = await setUp(uploadsDir);
    mkdirSync(uploadsDir, { recursive: true });
    execFileSync('mount', ['-t', 'tmpfs', '-o', 'size=1m,mode=0755', 'tmpfs', uploadsDir]);
    cleanups.push(() => execFileSync('umount', [uploadsDir]));
    // Fill the disk to the last byte.
    const filler = openSync(join(uploadsDir, 'filler'), 'w');
    try {
      const block = Buffer.alloc(4096, 0x20);
      for (;;) writeSync(filler, block);
    } catch (error) {
      expect((error as NodeJS.ErrnoException).code).toBe('ENOSPC');
    } finally {
      closeSync(filler);
    }
    const before = await rowsOf(roundupId, entryId, cellId);

    expectStorageError(await uploadPhoto(tester.agent), 507, 'storage_full');
    expectStorageError(await uploadRun(tester.agent), 507, 'storage_full');
    expect(await rowsOf(roundupId, entryId, cellId)).toEqual(before);
    expect(filesUnder(uploadsDir)).toEqual([join(uploadsDir, 'filler')]);
  });
});
