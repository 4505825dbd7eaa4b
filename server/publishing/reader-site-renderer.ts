import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import type { DataSource } from 'typeorm';
import { buildPublishedRoundup, type PublishedRoundup } from '../public-site/published-roundup';
import { loadReaderSiteSettings } from '../public-site/published-roundup-source';
import { readerAssetsFrom } from '../public-site/reader-assets';
import { readerBase } from '../public-site/public-paths';
import type { ReaderSite } from '../public-site/render-layout';
import { renderHomePage } from '../public-site/render-home-page';
import { renderRoundupPage } from '../public-site/render-roundup-page';
import type { PublicSiteRenderer, RenderedPage } from './public-site-renderer';

const htmlType = 'text/html; charset=utf-8';
/** Each page in °C for everyone, and in °F for readers whose unit cookie asks for it. */
const unitVariants = [
  { unit: 'C', variant: '' },
  { unit: 'F', variant: 'unit=F' },
] as const;

/**
 * Publishing through the reader site's model and renderers (server/public-site): the frozen model is
 * `buildPublishedRoundup`'s, and the snapshot holds the home page and each roundup's results page in both units.
 * Addresses the reader router renders on request (open data, photos, pages with a query) follow the roundup's state.
 */
export function readerSiteRenderer(
  dataSource: DataSource,
  options: { baseUrl: string },
): PublicSiteRenderer<PublishedRoundup> {
  // Pages are rendered at publication, away from any request: canonical links use the configured public address.
  const baseUrl = options.baseUrl.replace(/\/+$/, '');
  let assets: ReaderSite['assets'] | null = null;
  const site = async (): Promise<ReaderSite> => {
    assets ??= readerAssetsFrom(
      [resolve('dist', 'client'), resolve(import.meta.dirname, '..', 'client')].find((dir) =>
        existsSync(resolve(dir, 'index.html')),
      ),
    );
    const settings = await loadReaderSiteSettings(dataSource);
    return { baseUrl, outletName: settings.outletName, assets };
  };

  return {
    publicPrefixes: [readerBase, '/sitemap.xml', '/robots.txt'],

    async freeze(manager, roundupId, options) {
      const settings = await loadReaderSiteSettings(dataSource);
      return buildPublishedRoundup(manager, roundupId, {
        publishedAt: options.publishedAt,
        updatedAt: options.updatedAt,
        corrections: options.corrections,
        licence: settings.openDataLicence,
      });
    },

    async renderPages(models) {
      const readerSite = await site();
      const pages: RenderedPage[] = [];
      for (const { unit, variant } of unitVariants) {
        for (const model of models) {
          const body = renderRoundupPage(readerSite, model, { unit });
          pages.push({ path: model.path, variant, contentType: htmlType, body, roundupId: model.roundupId });
        }
        const home = renderHomePage(readerSite, models, { unit });
        pages.push({ path: readerBase, variant, contentType: htmlType, body: home, roundupId: null });
      }
      return pages;
    },

    async renderPreview(model) {
      return renderRoundupPage(await site(), model, { unit: 'C' });
    },
  };
}
