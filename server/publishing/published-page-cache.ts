import { createHash } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { brotliCompressSync, constants as zlibConstants, gzipSync } from 'node:zlib';
import type { DataSource, EntityManager } from 'typeorm';
import { PublishedPageEntity } from '../entities/published-page.entity';
import { contentSecurityPolicy } from '../middleware/security-headers';
import type { RenderedPage } from './public-site-renderer';

/** A page as stored: the body and its gzip and brotli forms, compressed once at publication. */
export interface StoredPage {
  path: string;
  variant: string;
  roundupId: number | null;
  contentType: string;
  etag: string;
  body: Buffer;
  bodyGzip: Buffer;
  bodyBrotli: Buffer;
}

type Encoding = 'br' | 'gzip' | 'identity';

interface CachedPage {
  /** Headers and body per encoding, built once when the page enters the cache. */
  responses: Record<Encoding, { headers: Record<string, string>; body: Buffer }>;
  etags: Set<string>;
}

/** Readers may keep a page a minute, then check it with the ETag (a 304 costs a few bytes). */
export const publishedCacheControl = 'public, max-age=60, must-revalidate';

// The app's own security headers (server/middleware/security-headers.ts), fixed here because this path runs before
// Express. The pages are served over whatever the site runs on; HSTS stays with the app's responses.
const securityHeaders = {
  'Content-Security-Policy': Object.entries(contentSecurityPolicy)
    .map(([directive, sources]) => `${directive} ${sources.join(' ')}`)
    .join(';'),
  'X-Content-Type-Options': 'nosniff',
  'X-Frame-Options': 'DENY',
  'Referrer-Policy': 'same-origin',
};

/** Compresses a rendered page once: gzip at level 9 and brotli at quality 11, with a strong ETag of the body. */
export function compressPage(page: RenderedPage): StoredPage {
  const body = Buffer.isBuffer(page.body) ? page.body : Buffer.from(page.body, 'utf8');
  const hash = createHash('sha256').update(page.contentType).update('\0').update(body).digest('base64url');
  return {
    path: page.path,
    variant: page.variant,
    roundupId: page.roundupId,
    contentType: page.contentType,
    etag: hash.slice(0, 32),
    body,
    bodyGzip: gzipSync(body, { level: 9 }),
    bodyBrotli: brotliCompressSync(body, {
      params: {
        [zlibConstants.BROTLI_PARAM_QUALITY]: 11,
        [zlibConstants.BROTLI_PARAM_SIZE_HINT]: body.length,
        [zlibConstants.BROTLI_PARAM_MODE]: page.contentType.startsWith('text/')
          ? zlibConstants.BROTLI_MODE_TEXT
          : zlibConstants.BROTLI_MODE_GENERIC,
      },
    }),
  };
}

/**
 * Writes the public pages of a publication inside its transaction: pages whose content changed are re-compressed
 * and stored, pages no longer rendered are removed, unchanged ones are left alone. Returns the paths it touched.
 */
export async function storeRenderedPages(manager: EntityManager, pages: RenderedPage[], now: Date): Promise<string[]> {
  const repository = manager.getRepository(PublishedPageEntity);
  const existing = await repository.find({ select: { path: true, variant: true, etag: true, contentType: true } });
  const key = (p: { path: string; variant: string }) => `${p.path}\n${p.variant}`;
  const before = new Map(existing.map((p) => [key(p), p]));
  const touched: string[] = [];
  const seen = new Set<string>();
  for (const page of pages) {
    seen.add(key(page));
    const stored = compressPage(page);
    if (before.get(key(page))?.etag === stored.etag) continue;
    await repository.upsert({ ...stored, updatedAt: now }, ['path', 'variant']);
    touched.push(page.path);
  }
  for (const old of existing) {
    if (seen.has(key(old))) continue;
    await repository.delete({ path: old.path, variant: old.variant });
    touched.push(old.path);
  }
  return touched;
}

function acceptedEncoding(header: string | string[] | undefined): Encoding {
  if (!header) return 'identity';
  const value = Array.isArray(header) ? header.join(',') : header;
  let gzip = false;
  let br = false;
  for (const part of value.split(',')) {
    const [name, ...params] = part.trim().toLowerCase().split(';');
    const q = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
    if (q && Number(q.slice(2)) === 0) continue;
    if (name === 'br') br = true;
    else if (name === 'gzip' || name === 'x-gzip') gzip = true;
    else if (name === '*') {
      br = true;
      gzip = true;
    }
  }
  return br ? 'br' : gzip ? 'gzip' : 'identity';
}

function matchesEtag(header: string | undefined, etags: Set<string>): boolean {
  if (!header) return false;
  if (header.trim() === '*') return true;
  for (const candidate of header.split(',')) {
    if (etags.has(candidate.trim().replace(/^W\//, ''))) return true;
  }
  return false;
}

/**
 * The published pages in memory, loaded at start-up and refreshed when something is published (here, or by another
 * process: `watch` checks the table's last change every few seconds). `serve` answers a request from memory with
 * precomputed headers, the body compressed as the client accepts, and 304 for a matching ETag; it is called before
 * Express, so a published page costs no middleware at all.
 */
export class PublishedPageCache {
  private pages = new Map<string, Map<string, CachedPage>>();
  private loaded: Promise<void> | null = null;
  private fingerprint = '';
  private watchTimer: NodeJS.Timeout | null = null;

  constructor(private readonly dataSource: DataSource) {}

  /** Loads every page once; later calls wait for the same load. */
  ensureLoaded(): Promise<void> {
    this.loaded ??= this.reload();
    return this.loaded;
  }

  get isLoaded(): boolean {
    return this.fingerprint !== '';
  }

  /** Reads every stored page again (after a publication). */
  async reload(): Promise<void> {
    const fingerprint = await this.currentFingerprint();
    const rows = await this.dataSource.getRepository(PublishedPageEntity).find();
    const pages = new Map<string, Map<string, CachedPage>>();
    const variantCounts = new Map<string, number>();
    for (const row of rows) variantCounts.set(row.path, (variantCounts.get(row.path) ?? 0) + 1);
    for (const row of rows) {
      const byVariant = pages.get(row.path) ?? new Map<string, CachedPage>();
      byVariant.set(row.variant, this.cached(row, (variantCounts.get(row.path) ?? 1) > 1));
      pages.set(row.path, byVariant);
    }
    this.pages = pages;
    this.fingerprint = fingerprint;
    this.loaded ??= Promise.resolve();
  }

  /** Checks every few seconds whether another process published, and reloads when it did. */
  watch(intervalMs = 2_000): void {
    if (this.watchTimer) return;
    const tick = async () => {
      try {
        if ((await this.currentFingerprint()) !== this.fingerprint) await this.reload();
      } catch {
        // The next tick tries again; the pages in memory stay as they were.
      } finally {
        if (this.watchTimer) this.watchTimer = setTimeout(tick, intervalMs);
      }
    };
    this.watchTimer = setTimeout(tick, intervalMs);
  }

  stopWatching(): void {
    if (this.watchTimer) clearTimeout(this.watchTimer);
    this.watchTimer = null;
  }

  has(path: string): boolean {
    return this.pages.has(path);
  }

  paths(): string[] {
    return [...this.pages.keys()];
  }

  /**
   * Answers a GET or HEAD for a published page and returns true; returns false (nothing written) for anything else,
   * so the request goes on to the app. A URL with a query string goes on too: the reader pages handle those.
   */
  serve(req: IncomingMessage, res: ServerResponse): boolean {
    if (req.method !== 'GET' && req.method !== 'HEAD') return false;
    const url = req.url ?? '/';
    if (url.includes('?')) return false;
    const byVariant = this.pages.get(url);
    if (!byVariant) return false;
    const page = (byVariant.size > 1 ? byVariant.get(variantOf(req)) : undefined) ?? byVariant.get('');
    if (!page) return false;
    const chosen = page.responses[acceptedEncoding(req.headers['accept-encoding'])];
    if (matchesEtag(req.headers['if-none-match'], page.etags)) {
      res.writeHead(304, {
        ETag: chosen.headers.ETag,
        'Cache-Control': chosen.headers['Cache-Control'],
        Vary: chosen.headers.Vary,
      });
      res.end();
      return true;
    }
    res.writeHead(200, chosen.headers);
    if (req.method === 'HEAD') res.end();
    else res.end(chosen.body);
    return true;
  }

  private cached(row: StoredPage, hasVariants: boolean): CachedPage {
    const vary = hasVariants ? 'Accept-Encoding, Cookie' : 'Accept-Encoding';
    const build = (encoding: Encoding, body: Buffer) => {
      const etag = `"${row.etag}${encoding === 'identity' ? '' : `-${encoding}`}"`;
      const headers: Record<string, string> = {
        'Content-Type': row.contentType,
        'Content-Length': String(body.length),
        ETag: etag,
        'Cache-Control': publishedCacheControl,
        Vary: vary,
        ...securityHeaders,
      };
      if (encoding !== 'identity') headers['Content-Encoding'] = encoding;
      return { headers, body };
    };
    const responses = {
      br: build('br', row.bodyBrotli),
      gzip: build('gzip', row.bodyGzip),
      identity: build('identity', row.body),
    };
    return { responses, etags: new Set(Object.values(responses).map((r) => r.headers.ETag)) };
  }

  private async currentFingerprint(): Promise<string> {
    const [row] = (await this.dataSource.query(
      'SELECT COUNT(*) AS pages, MAX(updated_at) AS latest FROM published_pages',
    )) as { pages: number | string; latest: Date | null }[];
    return `${row.pages}:${row.latest ? new Date(row.latest).getTime() : 0}`;
  }
}

/** The page variant a request asks for: the reader's temperature unit cookie. */
function variantOf(req: IncomingMessage): string {
  const cookie = req.headers.cookie;
  if (!cookie) return '';
  const unit = /(?:^|;\s*)bw_unit=([CF])(?:;|$)/.exec(cookie)?.[1];
  return unit ? `unit=${unit}` : '';
}
