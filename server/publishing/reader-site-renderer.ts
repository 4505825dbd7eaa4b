import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import type { DataSource } from 'typeorm';
import { buildPublishedRoundup, type PublishedRoundup } from '../public-site/published-roundup';
import { RoundupEntity } from '../entities/roundup.entity';
import {
  loadOpenDataSettings,
  loadReaderSiteSettings,
  signedOffWriteUp,
  withOpenDataSettings,
} from '../public-site/published-roundup-source';
import { readerAssetsFrom } from '../public-site/reader-assets';
import { publicPaths, readerBase } from '../public-site/public-paths';
import type { ApprovedChartImage } from '../services/charts.service';
import type { WriteUpsService } from '../services/write-ups.service';
import { parseChartKey } from '../../shared/domain/editorial/chart-data';
import type { ReaderSite } from '../public-site/render-layout';
import { renderHomePage } from '../public-site/render-home-page';
import { renderRoundupPage } from '../public-site/render-roundup-page';
import { readCompareChoice, renderComparePage } from '../public-site/render-compare-page';
import { estimatePointsFor, productAppearances, renderProductPage } from '../public-site/render-product-page';
import type { PublicSiteRenderer, RenderedPage } from './public-site-renderer';

const htmlType = 'text/html; charset=utf-8';
/** Each page in °C for everyone, and in °F for readers whose unit cookie asks for it. */
const unitVariants = [
  { unit: 'C', variant: '' },
  { unit: 'F', variant: 'unit=F' },
] as const;

/**
 * Publishing through the reader site's model and renderers (server/public-site): the frozen model is
 * `buildPublishedRoundup`'s, and the snapshot holds, in both units, the home page, each roundup's results page, each
 * published board's page and the empty compare form: every reader page without a query is served from memory. The
 * reader router renders the rest on request (open data, photos, feeds, pages with a query) from the same frozen
 * models, with the same renderers, so a page is the same whichever answers it.
 */
export function readerSiteRenderer(
  dataSource: DataSource,
  options: {
    baseUrl: string;
    /** The signed-off write-up text frozen with the data (none when omitted). */
    writeUps?: Pick<WriteUpsService, 'renderedSections'>;
    /** The approved chart images frozen with the data (none when omitted). */
    chartImages?: (roundupId: number) => Promise<ApprovedChartImage[]>;
  },
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

    async freeze(manager, roundupId, freezeOptions) {
      const settings = await loadReaderSiteSettings(dataSource);
      const written = await signedOffWriteUp(dataSource, options.writeUps, roundupId);
      const images = options.chartImages ? await options.chartImages(roundupId) : [];
      const roundup = await manager.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId });
      // Raw logger files are frozen with the data; whether they are offered is the editor's switch, applied when the
      // pages are rendered and served (withOpenDataSettings).
      const model = await buildPublishedRoundup(manager, roundupId, {
        publishedAt: freezeOptions.publishedAt,
        updatedAt: freezeOptions.updatedAt,
        corrections: freezeOptions.corrections,
        licence: settings.openDataLicence,
        rawFilesAllowed: true,
        writeUps: written.byEntry,
        writeUpSections: written.sections,
      });
      const chartImages = images.flatMap((image) => {
        const parsed = parseChartKey(image.key);
        if (image.stale || parsed?.kind !== 'configuration') return [];
        return [
          {
            configurationId: parsed.id,
            url: publicPaths.chartImage(model.path, image.key),
            width: image.width,
            height: image.height,
            key: image.key,
            storageKey: image.storageKey,
          },
        ];
      });
      return {
        ...model,
        chartImages,
        openData: { ...model.openData, rawFilesAllowed: roundup.openDataRawFiles === true },
      };
    },

    async renderPages(frozen) {
      const readerSite = await site();
      const openData = await loadOpenDataSettings(
        dataSource,
        frozen.map((m) => m.roundupId),
      );
      const models = frozen.map((model) => withOpenDataSettings(model, openData));
      const pages: RenderedPage[] = [];
      for (const { unit, variant } of unitVariants) {
        for (const model of models) {
          const body = renderRoundupPage(readerSite, model, { unit });
          pages.push({ path: model.path, variant, contentType: htmlType, body, roundupId: model.roundupId });
        }
        const home = renderHomePage(readerSite, models, { unit });
        pages.push({ path: readerBase, variant, contentType: htmlType, body: home, roundupId: null });
        // A board's page at its address of record (the roundup that tested it); other slugs are redirected there.
        for (const productId of new Set(models.flatMap((m) => m.products.map((p) => p.productId)))) {
          const appearances = productAppearances(models, productId);
          const path = (appearances.find((a) => a.product.kind === 'tested') ?? appearances[0]).product.path;
          const body = renderProductPage(readerSite, appearances, {
            unit,
            estimate: null,
            pointCount: estimatePointsFor(appearances).length,
            query: new URLSearchParams(),
          });
          pages.push({ path, variant, contentType: htmlType, body, roundupId: null });
        }
        const compare = renderComparePage(readerSite, models, readCompareChoice({}), {
          unit,
          query: new URLSearchParams(),
        });
        pages.push({ path: publicPaths.compare(), variant, contentType: htmlType, body: compare, roundupId: null });
      }
      return pages;
    },

    async renderPreview(model) {
      return renderRoundupPage(await site(), model, { unit: 'C' });
    },
  };
}
