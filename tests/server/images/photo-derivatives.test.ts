import sharp from 'sharp';
import { crc32 } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { maxPhotoPixels, processPhoto } from '../../../server/images/photo-derivatives';
import { AppError } from '../../../server/errors';

/** A 200 × 100 JPEG whose left half is red and right half blue, tagged with an EXIF orientation and a GPS position. */
async function taggedJpeg(orientation: number) {
  const left = await sharp({ create: { width: 100, height: 100, channels: 3, background: '#ff0000' } })
    .png()
    .toBuffer();
  return sharp({ create: { width: 200, height: 100, channels: 3, background: '#0000ff' } })
    .composite([{ input: left, left: 0, top: 0 }])
    .jpeg()
    .withMetadata({ orientation })
    .withExif({
      IFD0: { Make: 'Bench camera' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 28/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 0/1 5/1' },
    })
    .toBuffer();
}

/** A PNG made of a real header that declares width × height, one tiny IDAT and IEND (PNG spec, RFC 2083 §3–4). */
function pngDeclaring(width: number, height: number) {
  const chunk = (type: string, data: Buffer) => {
    const length = Buffer.alloc(4);
    length.writeUInt32BE(data.length);
    const typed = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(typed) >>> 0);
    return Buffer.concat([length, typed, crc]);
  };
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header[8] = 8; // bit depth
  header[9] = 2; // colour type: truecolour
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', Buffer.from([0x78, 0x9c, 0x03, 0x00, 0x00, 0x00, 0x00, 0x01])),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

async function pixel(image: Buffer, x: number, y: number) {
  const { data, info } = await sharp(image).raw().toBuffer({ resolveWithObject: true });
  const offset = (y * info.width + x) * info.channels;
  return [data[offset], data[offset + 1], data[offset + 2]];
}

describe('photo derivatives', () => {
  it('when a JPEG carries EXIF orientation 6, then every web size is stored upright with no EXIF or GPS left', async () => {
    const upload = await taggedJpeg(6);
    const uploaded = await sharp(upload).metadata();
    expect(uploaded.orientation).toBe(6);
    expect(upload.includes(Buffer.from('Bench camera'))).toBe(true); // the tag really is in the upload
    const processed = await processPhoto(upload);
    // Orientation 6: "the 0th row is the visual right-hand side, the 0th column the visual top" — the picture is
    // turned 90° clockwise for display, so the stored 200 × 100 frame shows as 100 × 200 with the red half on top.
    // (Exif 2.3, CIPA DC-008, Orientation tag; from memory.)
    expect([processed.width, processed.height]).toEqual([100, 200]);
    expect(processed.derivatives).toHaveLength(2); // one width (the original's 100 px), WebP + JPEG
    for (const derivative of processed.derivatives) {
      const meta = await sharp(derivative.body).metadata();
      expect([meta.width, meta.height]).toEqual([100, 200]);
      expect(meta.exif).toBeUndefined();
      expect(meta.orientation).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(derivative.body.includes(Buffer.from('Exif'))).toBe(false);
      expect(derivative.body.includes(Buffer.from('Bench camera'))).toBe(false);
      const [r, , b] = await pixel(derivative.body, 50, 20);
      expect(r).toBeGreaterThan(200);
      expect(b).toBeLessThan(60);
      const [r2, , b2] = await pixel(derivative.body, 50, 180);
      expect(b2).toBeGreaterThan(200);
      expect(r2).toBeLessThan(60);
    }
  });

  it('when a photo is wider than the largest web size, then 480, 960 and 1920 px widths are written in WebP and JPEG', async () => {
    const wide = await sharp({ create: { width: 2400, height: 1200, channels: 3, background: '#336699' } })
      .png()
      .toBuffer();
    const processed = await processPhoto(wide);
    expect(processed.derivatives.map((d) => `${d.width}x${d.height}.${d.format}`)).toEqual([
      '480x240.webp',
      '480x240.jpeg',
      '960x480.webp',
      '960x480.jpeg',
      '1920x960.webp',
      '1920x960.jpeg',
    ]);
  });

  it('when a file is not an image but is named like one, then it is refused by content with 415', async () => {
    const error = await processPhoto(Buffer.from('Time,VRM 1\n0,21.0\n')).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).status).toBe(415);
  });

  it('when an image is an SVG (which can carry script), then it is refused with 415', async () => {
    const svg = Buffer.from(
      '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><script>alert(1)</script></svg>',
    );
    const error = await processPhoto(svg).catch((e: unknown) => e);
    expect((error as AppError).status).toBe(415);
  });

  it('when a header declares 100,000 × 100,000 px, then the pixel limit refuses it before decoding', async () => {
    const bomb = pngDeclaring(100_000, 100_000);
    expect(bomb.length).toBeLessThan(100);
    expect(100_000 * 100_000).toBeGreaterThan(maxPhotoPixels);
    const error = await processPhoto(bomb).catch((e: unknown) => e);
    expect((error as AppError).status).toBe(422);
    expect((error as AppError).code).toBe('image_too_large');
  });

  it('when an image is cut short, then it is refused with 422, not a crash', async () => {
    const whole = await sharp({ create: { width: 400, height: 300, channels: 3, background: '#aa3300' } })
      .jpeg()
      .toBuffer();
    const error = await processPhoto(whole.subarray(0, Math.floor(whole.length / 2))).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).status).toBe(422);
  });
});
