import sharp from 'sharp';
import { existsSync, readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { PhotoEntity } from '../../../server/entities/photo.entity';
import { asBytes, signedInTeam, testDataSource, testUploadsDir, type Client } from '../support/test-app';
import { addEntry, createProduct, createRoundup } from '../planning/support/planning-fixtures';

async function setUp() {
  const { editor, tester, writer } = await signedInTeam();
  const { roundupId, platform } = await createRoundup(editor.agent, { configurations: 1 });
  const { entry } = await addEntry(editor.agent, roundupId, await createProduct(editor.agent, platform));
  return {
    editor,
    tester,
    writer,
    roundupId,
    entryId: entry.id,
    base: `/api/roundups/${roundupId}/entries/${entry.id}`,
  };
}

/** A 300 × 200 JPEG tagged with EXIF orientation 6 and a GPS position. */
function rotatedJpegWithGps() {
  return sharp({ create: { width: 300, height: 200, channels: 3, background: '#cc5522' } })
    .jpeg()
    .withMetadata({ orientation: 6 })
    .withExif({ IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '48/1 8/1 0/1' } })
    .toBuffer();
}

function upload(agent: Client, url: string, file: Buffer, name: string, fields: Record<string, string>) {
  let call = agent.post(url).attach('file', file, name);
  for (const [key, value] of Object.entries(fields)) call = call.field(key, value);
  return call;
}

const filesOnDisk = () => (existsSync(testUploadsDir) ? readdirSync(testUploadsDir, { recursive: true }).length : 0);

async function photoRows(entryId: number) {
  return (await testDataSource()).getRepository(PhotoEntity).countBy({ entryId });
}

describe('photos of a product in a roundup', () => {
  it('when a tester uploads an EXIF-rotated JPEG, then every web size is upright with no EXIF or GPS, served to staff only', async () => {
    const { tester, writer, base } = await setUp();
    const response = await upload(tester.agent, `${base}/photos`, await rotatedJpegWithGps(), 'board.jpg', {
      kind: 'overview',
      caption: 'The board on the open bench',
      altText: 'Top view of the board with its two finned heatsinks',
    });
    expect(response.status, response.text).toBe(201);
    // Orientation 6 turns the stored 300 × 200 frame to 200 × 300 for display (Exif 2.3 Orientation tag; from memory).
    expect(response.body).toMatchObject({ width: 200, height: 300, position: 1, kind: 'overview' });
    expect(response.body.sizes.map((s: { format: string }) => s.format)).toEqual(['webp', 'jpeg']);
    for (const size of response.body.sizes as { url: string; format: string }[]) {
      const file = await asBytes(writer.agent.get(size.url));
      expect(file.status).toBe(200);
      expect(file.headers['content-type']).toBe(size.format === 'webp' ? 'image/webp' : 'image/jpeg');
      expect(file.headers['x-content-type-options']).toBe('nosniff');
      const meta = await sharp(file.body as Buffer).metadata();
      expect([meta.width, meta.height]).toEqual([200, 300]);
      expect(meta.exif).toBeUndefined();
      expect(meta.orientation).toBeUndefined();
    }
  });

  it('when a file is not an image but is named .jpg, then 415 and nothing is stored', async () => {
    const { tester, base, entryId } = await setUp();
    const before = filesOnDisk();
    const response = await upload(tester.agent, `${base}/photos`, Buffer.from('Time,VRM 1\n0,21\n'), 'board.jpg', {
      kind: 'overview',
      altText: 'A photo',
    });
    expect(response.status).toBe(415);
    expect(response.body.error.message).toMatch(/JPEG, PNG or WebP/);
    expect(filesOnDisk()).toBe(before);
    expect(await photoRows(entryId)).toBe(0);
  });

  it('when an image header declares a huge size, then the pixel limit refuses it with 422 and nothing is stored', async () => {
    const { tester, base, entryId } = await setUp();
    // A real 1 × 1 PNG whose IHDR is rewritten to declare 60,000 × 60,000 px (PNG spec, IHDR width/height at bytes
    // 16–23); the CRC is left stale, which the header reader does not check before the size.
    const png = Buffer.from(
      await sharp({ create: { width: 1, height: 1, channels: 3, background: '#000' } })
        .png()
        .toBuffer(),
    );
    png.writeUInt32BE(60_000, 16);
    png.writeUInt32BE(60_000, 20);
    const before = filesOnDisk();
    const response = await upload(tester.agent, `${base}/photos`, png, 'bomb.png', { kind: 'other', altText: 'x' });
    expect([415, 422]).toContain(response.status);
    expect(filesOnDisk()).toBe(before);
    expect(await photoRows(entryId)).toBe(0);
  });

  it('alt text is required; a writer may not upload; photos are reordered by listing them', async () => {
    const { tester, writer, base } = await setUp();
    const image = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#1f6f6b' } })
      .png()
      .toBuffer();
    const noAlt = await upload(tester.agent, `${base}/photos`, image, 'a.png', { kind: 'heatsinks' });
    expect(noAlt.status, noAlt.text).toBe(400);
    expect(noAlt.body.error.fields.altText).toBe('Describe the photo for people who cannot see it.');
    expect(
      (await upload(writer.agent, `${base}/photos`, image, 'a.png', { kind: 'heatsinks', altText: 'x' })).status,
    ).toBe(403);
    const first = (
      await upload(tester.agent, `${base}/photos`, image, 'a.png', { kind: 'heatsinks', altText: 'Heatsink, left' })
    ).body;
    const second = (
      await upload(tester.agent, `${base}/photos`, image, 'b.png', { kind: 'other', altText: 'Rear I/O' })
    ).body;
    const reordered = await tester.agent.put(`${base}/photo-order`).send({ photoIds: [second.id, first.id] });
    expect(reordered.status, reordered.text).toBe(200);
    expect(reordered.body.photos.map((p: { id: number }) => p.id)).toEqual([second.id, first.id]);
    const partial = await tester.agent.put(`${base}/photo-order`).send({ photoIds: [second.id] });
    expect(partial.status).toBe(422);
    expect(partial.body.error.fields.photoIds).toMatch(/exactly once/);
    const removed = await tester.agent.delete(`/api/photos/${first.id}`);
    expect(removed.status).toBe(204);
    expect((await writer.agent.get(`${base}/photos`)).body.photos).toHaveLength(1);
  });
});
