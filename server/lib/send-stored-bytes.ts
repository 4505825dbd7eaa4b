import type { Response } from 'express';

/**
 * Sends stored bytes (a chart image, a photo size, a logger file) as they are: the type stated and never sniffed,
 * `cacheControl` saying how long a browser may keep them, `headers` any the route adds (name, checksum, ETag).
 */
export function sendStoredBytes(
  res: Response,
  body: Buffer,
  contentType: string,
  cacheControl: string,
  headers: Record<string, string> = {},
) {
  res.setHeader('Content-Type', contentType);
  for (const [name, value] of Object.entries(headers)) res.setHeader(name, value);
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Cache-Control', cacheControl);
  res.status(200).end(body);
}
