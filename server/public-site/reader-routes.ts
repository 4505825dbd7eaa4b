import express, { type Request, type Response } from 'express';
import type { DataSource } from 'typeorm';
import { PhotoEntity } from '../entities/photo.entity';
import { StoredFileEntity } from '../entities/stored-file.entity';
import { TestRunEntity } from '../entities/test-run.entity';
import type { FileStore } from '../storage/file-store';
import { parseDisplayUnit, type DisplayUnit } from '../../shared/domain/reader/temperature-display';
import { html } from './html';
import { analysisJson, resultsCsv } from './open-data';
import { idFromSlug, publicPaths, readerBase } from './public-paths';
import type { PublishedRoundup } from './published-roundup';
import { loadReaderSiteSettings, type PublishedRoundupSource } from './published-roundup-source';
import type { ReaderAssets } from './reader-assets';
import { renderHomePage } from './render-home-page';
import { renderPage, type ReaderSite } from './render-layout';
import { renderRoundupPage } from './render-roundup-page';
import { atomFeed, robotsTxt, sitemapXml } from './feeds';
import { readCompareChoice, renderComparePage } from './render-compare-page';
import { estimatePointsFor, productAppearances, readEstimateForm, renderProductPage } from './render-product-page';

export interface ReaderRoutesOptions {
  dataSource: DataSource;
  files: FileStore;
  source: PublishedRoundupSource;
  assets: ReaderAssets;
  /** Absolute public origin (PUBLIC_SITE_URL); the request's own origin when unset. */
  publicSiteUrl?: string;
  /** Photo bytes of a published photo; the photos service in the app. */
  photoFile: (photoId: number, size: string) => Promise<{ body: Buffer; contentType: string }>;
}

export const unitCookie = 'bw_unit';
const yearSeconds = 365 * 24 * 3600;

/**
 * The reader's unit: `?unit=` (remembered in a cookie for the next pages), else the cookie, else °C. Works without
 * JavaScript; the reader script sets the same cookie when it switches in place.
 */
export function readerUnit(req: Request, res: Response): DisplayUnit {
  const fromQuery = parseDisplayUnit(req.query.unit);
  if (fromQuery) {
    res.append('Set-Cookie', `${unitCookie}=${fromQuery}; Path=/; Max-Age=${yearSeconds}; SameSite=Lax`);
    return fromQuery;
  }
  const cookie = /(?:^|;\s*)bw_unit=([CF])(?:;|$)/.exec(req.headers.cookie ?? '');
  return parseDisplayUnit(cookie?.[1]) ?? 'C';
}

/** The query without `unit`, for links that keep the reader's other choices. */
export function queryWithoutUnit(req: Request): URLSearchParams {
  const query = new URLSearchParams(req.url.split('?')[1] ?? '');
  query.delete('unit');
  return query;
}

function sendHtml(res: Response, status: number, body: string) {
  res.status(status);
  res.setHeader('Content-Type', 'text/html; charset=utf-8');
  res.setHeader('Cache-Control', 'no-cache');
  // The page varies with the unit cookie.
  res.setHeader('Vary', 'Cookie');
  res.end(body);
}

export function renderNotFoundPage(site: ReaderSite, unit: DisplayUnit): string {
  return renderPage(
    site,
    { title: 'Page not found', description: 'This page does not exist.', path: readerBase, ogType: 'website' },
    unit,
    html`<h1>Page not found</h1>
      <p>There is no page at this address. <a href="${publicPaths.home()}">See the published roundups</a>.</p>`,
  );
}

/** The reader site: server-rendered pages under /read, open data, photos, feeds and crawler files. */
export function createReaderRouter(options: ReaderRoutesOptions) {
  const router = express.Router();

  async function siteFor(req: Request): Promise<ReaderSite> {
    const settings = await loadReaderSiteSettings(options.dataSource);
    const origin = options.publicSiteUrl?.replace(/\/+$/, '') || `${req.protocol}://${req.get('host') ?? 'localhost'}`;
    return { baseUrl: origin, outletName: settings.outletName, assets: options.assets };
  }

  async function notFound(req: Request, res: Response) {
    sendHtml(res, 404, renderNotFoundPage(await siteFor(req), readerUnit(req, res)));
  }

  /** The published roundup named by an `:id-:slug` segment, or null (answered 404 by the caller). */
  async function roundupOf(segment: string): Promise<PublishedRoundup | null> {
    const id = idFromSlug(segment);
    return id === null ? null : options.source.get(id);
  }

  router.get(readerBase, async (req, res) => {
    const unit = readerUnit(req, res);
    sendHtml(res, 200, renderHomePage(await siteFor(req), await options.source.list(), { unit }));
  });

  router.get(`${readerBase}/roundups/:slug`, async (req, res) => {
    const model = await roundupOf(req.params.slug);
    if (!model) return notFound(req, res);
    if (req.path !== model.path) {
      const query = req.url.includes('?') ? req.url.slice(req.url.indexOf('?')) : '';
      return res.redirect(301, `${model.path}${query}`);
    }
    const unit = readerUnit(req, res);
    sendHtml(res, 200, renderRoundupPage(await siteFor(req), model, { unit }));
  });

  router.get(`${readerBase}/roundups/:slug/results.csv`, async (req, res) => {
    const model = await roundupOf(req.params.slug);
    if (!model) return notFound(req, res);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8; header=present');
    res.setHeader('Content-Disposition', `attachment; filename="roundup-${model.roundupId}-results.csv"`);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.end(resultsCsv(model));
  });

  router.get(`${readerBase}/roundups/:slug/analysis.json`, async (req, res) => {
    const model = await roundupOf(req.params.slug);
    if (!model) return notFound(req, res);
    const site = await siteFor(req);
    res.setHeader('Content-Type', 'application/json; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="roundup-${model.roundupId}-analysis.json"`);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.end(JSON.stringify(analysisJson(model, site.baseUrl), null, 2));
  });

  router.get(`${readerBase}/roundups/:slug/raw/:file`, async (req, res) => {
    const model = await roundupOf(req.params.slug);
    const result = model?.openData.rawFilesAllowed
      ? model.results.find((r) => r.rawFile?.name === req.params.file)
      : undefined;
    if (!model || !result) return notFound(req, res);
    const run = await options.dataSource.getRepository(TestRunEntity).findOneBy({ id: result.runId });
    const file = run?.loggerFileId
      ? await options.dataSource.getRepository(StoredFileEntity).findOneBy({ id: run.loggerFileId })
      : null;
    const body = file ? await options.files.get(file.storageKey) : null;
    if (!body) return notFound(req, res);
    res.setHeader('Content-Type', 'text/plain; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${result.rawFile?.name}"`);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.end(body);
  });

  router.get(`${readerBase}/roundups/:slug/charts/:image`, async (req, res) => {
    const model = await roundupOf(req.params.slug);
    // Only an image the publication froze is public; a roundup without a publication record has none.
    const image = model?.chartImages.find((i) => i.key && `${i.key}.png` === req.params.image);
    const body = image?.storageKey ? await options.files.get(image.storageKey) : null;
    if (!body) return notFound(req, res);
    res.setHeader('Content-Type', 'image/png');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Cache-Control', 'public, max-age=86400');
    res.end(body);
  });

  router.get(`${readerBase}/photos/:photoId/:size`, async (req, res) => {
    const photoId = idFromSlug(req.params.photoId);
    const size = req.params.size;
    if (photoId === null || !/^\d{1,5}\.(webp|jpeg)$/.test(size)) return notFound(req, res);
    const photo = await options.dataSource.getRepository(PhotoEntity).findOneBy({ id: photoId });
    const model = photo ? await options.source.get(photo.roundupId) : null;
    // Only a photo the published page shows is public; the rest stay with staff.
    if (!model?.products.some((p) => p.photos.some((shown) => shown.id === photoId))) return notFound(req, res);
    try {
      const { body, contentType } = await options.photoFile(photoId, size);
      res.setHeader('Content-Type', contentType);
      res.setHeader('X-Content-Type-Options', 'nosniff');
      res.setHeader('Cache-Control', 'public, max-age=86400');
      res.end(body);
    } catch {
      return notFound(req, res);
    }
  });

  router.get(`${readerBase}/products/:slug`, async (req, res) => {
    const productId = idFromSlug(req.params.slug);
    const appearances = productId === null ? [] : productAppearances(await options.source.list(), productId);
    if (appearances.length === 0) return notFound(req, res);
    const canonical = (appearances.find((a) => a.product.kind === 'tested') ?? appearances[0]).product.path;
    if (req.path !== canonical) {
      const query = req.url.includes('?') ? req.url.slice(req.url.indexOf('?')) : '';
      return res.redirect(301, `${canonical}${query}`);
    }
    const unit = readerUnit(req, res);
    const points = estimatePointsFor(appearances);
    const estimate = readEstimateForm(req.query as Record<string, unknown>, unit, points);
    sendHtml(
      res,
      200,
      renderProductPage(await siteFor(req), appearances, {
        unit,
        estimate,
        pointCount: points.length,
        query: queryWithoutUnit(req),
      }),
    );
  });

  router.get(publicPaths.compare(), async (req, res) => {
    const unit = readerUnit(req, res);
    const choice = readCompareChoice(req.query as Record<string, unknown>);
    sendHtml(
      res,
      200,
      renderComparePage(await siteFor(req), await options.source.list(), choice, {
        unit,
        query: queryWithoutUnit(req),
      }),
    );
  });

  router.get(publicPaths.feed(), async (req, res) => {
    res.setHeader('Content-Type', 'application/atom+xml; charset=utf-8');
    res.setHeader('Cache-Control', 'no-cache');
    res.end(atomFeed(await siteFor(req), await options.source.list()));
  });

  router.get(publicPaths.sitemap(), async (req, res) => {
    res.setHeader('Content-Type', 'application/xml; charset=utf-8');
    res.setHeader('Cache-Control', 'no-cache');
    res.end(sitemapXml(await siteFor(req), await options.source.list()));
  });

  router.get(publicPaths.robots(), async (req, res) => {
    res.setHeader('Content-Type', 'text/plain; charset=utf-8');
    res.end(robotsTxt(await siteFor(req)));
  });

  router.get(`${readerBase}/{*rest}`, notFound);
  return router;
}
