import type { DisplayUnit } from '../../shared/domain/reader/temperature-display';
import { html } from './html';
import { longDate, price } from './format';
import type { PublishedRoundup } from './published-roundup';
import { renderPage, type ReaderSite } from './render-layout';
import { publicPaths } from './public-paths';

/** The reader home: recent roundups, newest first, each with its picks. */
export function renderHomePage(
  site: ReaderSite,
  models: readonly PublishedRoundup[],
  options: { unit: DisplayUnit },
): string {
  const body = html`<div class="home">
    <h1>Power-delivery roundups</h1>
    <p class="standfirst">
      We soak every board for an hour at each load with thermocouples on its power stages, publish the figures with
      their tolerance, and give you the raw data.
    </p>
    ${
      models.length === 0
        ? html`<p>
            No roundup is published yet. Come back soon, or follow the <a href="${publicPaths.feed()}">feed</a>.
          </p>`
        : html`<ol class="roundup-list">
            ${models.map((model) => {
              const picks = model.picks
                .map((pick) => ({ pick, product: model.products.find((p) => p.entryId === pick.entryId) }))
                .filter((p) => p.product);
              const tested = model.products.filter((p) => p.kind === 'tested').length;
              return html`<li class="roundup-card">
                <h2><a href="${model.path}">${model.headline}</a></h2>
                <p class="dateline">
                  <time datetime="${model.publishedAt}">${longDate(model.publishedAt)}</time> · ${model.platform} ·
                  ${tested} boards · ${price(model.priceBand.minMinor, model.priceBand.currency)} to
                  ${price(model.priceBand.maxMinor, model.priceBand.currency)}
                </p>
                ${model.standfirst ? html`<p>${model.standfirst}</p>` : ''}
                ${
                  picks.length
                    ? html`<ul class="pick-list">
                        ${picks.map(
                          ({ pick, product }) =>
                            html`<li><span class="pick-label">${pick.label}</span> ${product?.name}</li>`,
                        )}
                      </ul>`
                    : ''
                }
              </li>`;
            })}
          </ol>`
    }
    <p><a href="${publicPaths.compare()}">Compare boards across roundups</a></p>
  </div>`;
  return renderPage(
    site,
    {
      title: 'Roundups',
      description: 'Power-delivery temperature roundups of motherboards, with open data.',
      path: publicPaths.home(),
      ogType: 'website',
    },
    options.unit,
    body,
  );
}
