import sharp, { type Metadata } from 'sharp';
import { AppError } from '../errors';

/** Web sizes written for every photo: widths in px, each as WebP and as a JPEG fallback. */
export const photoWidths = [480, 960, 1920] as const;
/**
 * Largest image accepted, in pixels (width × height), checked from the header before any pixel is decoded: a
 * 12,000 × 4,000 panorama fits; a "decompression bomb" whose header declares 100,000 × 100,000 does not.
 */
export const maxPhotoPixels = 48_000_000;
/** Formats accepted, judged from the file's content (its magic bytes as read by libvips), never its name. */
const acceptedFormats = new Set(['jpeg', 'png', 'webp']);

export interface PhotoDerivative {
  width: number;
  height: number;
  format: 'webp' | 'jpeg';
  contentType: 'image/webp' | 'image/jpeg';
  body: Buffer;
}

export interface ProcessedPhoto {
  /** Upright size of the original (after applying its orientation tag). */
  width: number;
  height: number;
  sourceFormat: string;
  derivatives: PhotoDerivative[];
}

/**
 * Reads an uploaded photo and writes its web sizes: refuses what is not a JPEG, PNG or WebP by content (415),
 * refuses an image over the pixel limit from its header alone (422), turns it upright from its orientation tag and
 * drops every metadata block (EXIF with GPS, XMP, IPTC, comments) — sharp keeps none unless asked to.
 */
export async function processPhoto(upload: Buffer): Promise<ProcessedPhoto> {
  let metadata: Metadata;
  try {
    metadata = await sharp(upload, { limitInputPixels: false }).metadata();
  } catch {
    throw new AppError('unsupported_image', 415, 'This file is not a JPEG, PNG or WebP image. Choose a photo file.');
  }
  if (!metadata.format || !acceptedFormats.has(metadata.format)) {
    throw new AppError(
      'unsupported_image',
      415,
      `This is ${metadata.format ? `a ${metadata.format.toUpperCase()} file` : 'not an image'}; photos must be JPEG, PNG or WebP.`,
    );
  }
  const declaredPixels = (metadata.width ?? 0) * (metadata.height ?? 0);
  if (!metadata.width || !metadata.height || declaredPixels > maxPhotoPixels) {
    throw new AppError(
      'image_too_large',
      422,
      `The image declares ${metadata.width ?? '?'} × ${metadata.height ?? '?'} px; the limit is ${(maxPhotoPixels / 1e6).toFixed(0)} megapixels. Resize it and upload again.`,
    );
  }
  const swapsSides = (metadata.orientation ?? 1) >= 5; // EXIF orientations 5–8 turn the picture by 90°
  const width = swapsSides ? metadata.height : metadata.width;
  const height = swapsSides ? metadata.width : metadata.height;

  const targets = [...new Set(photoWidths.map((w) => Math.min(w, width)))];
  const derivatives: PhotoDerivative[] = [];
  try {
    for (const targetWidth of targets) {
      const base = () =>
        sharp(upload, { limitInputPixels: maxPhotoPixels, failOn: 'error' })
          .rotate()
          .resize({ width: targetWidth, withoutEnlargement: true });
      const webp = await base().webp({ quality: 80 }).toBuffer({ resolveWithObject: true });
      const jpeg = await base()
        .flatten({ background: '#ffffff' })
        .jpeg({ quality: 82, mozjpeg: true })
        .toBuffer({ resolveWithObject: true });
      derivatives.push(
        {
          width: webp.info.width,
          height: webp.info.height,
          format: 'webp',
          contentType: 'image/webp',
          body: webp.data,
        },
        {
          width: jpeg.info.width,
          height: jpeg.info.height,
          format: 'jpeg',
          contentType: 'image/jpeg',
          body: jpeg.data,
        },
      );
    }
  } catch {
    throw new AppError(
      'unreadable_image',
      422,
      'The image is damaged or cut short and could not be read. Export it again and upload the new file.',
    );
  }
  return { width, height, sourceFormat: metadata.format, derivatives };
}
