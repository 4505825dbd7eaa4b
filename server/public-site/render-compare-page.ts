import { compareLikeForLike, type ComparableResult, type Comparison } from '../../shared/domain/reader/compare';
import type { DisplayUnit } from '../../shared/domain/reader/temperature-display';
import { html } from './html';
import { watts } from './format';
import type { PublishedConfiguration, PublishedRoundup } from './published-roundup';
import { renderPage, type ReaderSite } from './render-layout';
import { renderResultsChart, resultFigures } from './render-results-chart';
import { productAnchor } from './render-roundup-page';
import { publicPaths } from './public-paths';

export interface CompareChoice {
  productIds: number[];
  configurationId: number | null;
}

/** Reads `product` (repeated) and `configuration` from the compare form's GET query; unknown values are dropped. */
export function readCompareChoice(query: { product?: unknown; configuration?: unknown }): CompareChoice {
  const raw = Array.isArray(query.product) ? query.product : query.product === undefined ? [] : [query.product];
  const productIds = [
    ...new Set(raw.filter((v): v is string => typeof v === 'string' && /^[1-9][0-9]{0,9}$/.test(v)).map(Number)),
  ].slice(0, 12);
  const configuration =
    typeof query.configuration === 'string' && /^[1-9][0-9]{0,9}$/.test(query.configuration)
      ? Number(query.configuration)
      : null;
  return { productIds, configurationId: configuration };
}

interface Catalog {
  products: { productId: number; name: string; path: string }[];
  configurations: PublishedConfiguration[];
  results: (ComparableResult & { path: string; roundupPath: string })[];
}

/** Every board tested in a published roundup and every load configuration used, for the compare form. */
export function compareCatalog(models: readonly PublishedRoundup[]): Catalog {
  const products = new Map<number, { productId: number; name: string; path: string }>();
  const configurations = new Map<number, PublishedConfiguration>();
  const results: Catalog['results'] = [];
  for (const model of models) {
    for (const c of model.configurations) if (!configurations.has(c.id)) configurations.set(c.id, c);
    for (const product of model.products) {
      // Reference entries repeat an earlier roundup's run: that roundup lists it already.
      if (product.kind !== 'tested') continue;
      if (!products.has(product.productId))
        products.set(product.productId, { productId: product.productId, name: product.name, path: product.path });
      for (const r of model.results.filter((x) => x.entryId === product.entryId)) {
        results.push({
          productId: product.productId,
          productName: product.name,
          roundupId: model.roundupId,
          roundupTitle: model.headline,
          publishedAt: model.publishedAt,
          benchProfileId: model.benchProfile?.id ?? null,
          benchProfileName: model.benchProfile?.name ?? null,
          configurationId: r.configurationId,
          status: r.status,
          deltaOverAmbientC: r.deltaOverAmbientC,
          path: `${model.path}#${productAnchor(product.entryId)}`,
          roundupPath: model.path,
        });
      }
    }
  }
  return {
    products: [...products.values()].sort((a, b) => a.name.localeCompare(b.name)),
    configurations: [...configurations.values()].sort((a, b) => a.packagePowerW - b.packagePowerW),
    results,
  };
}

export function compareFor(catalog: Catalog, choice: CompareChoice): Comparison | null {
  if (choice.configurationId === null || choice.productIds.length === 0) return null;
  const chosen = choice.productIds
    .map((id) => catalog.products.find((p) => p.productId === id))
    .filter((p) => p !== undefined)
    .map((p) => ({ productId: p.productId, productName: p.name }));
  return compareLikeForLike(
    chosen,
    choice.configurationId,
    catalog.results,
    new Map(catalog.configurations.map((c) => [c.id, c.name])),
  );
}

/** The compare page: a GET form (works without JavaScript), then the chart and table of what compares. */
export function renderComparePage(
  site: ReaderSite,
  models: readonly PublishedRoundup[],
  choice: CompareChoice,
  options: { unit: DisplayUnit; query?: URLSearchParams },
): string {
  const { unit } = options;
  const catalog = compareCatalog(models);
  const comparison = compareFor(catalog, choice);
  const configuration = catalog.configurations.find((c) => c.id === choice.configurationId) ?? null;
  const asked = choice.productIds.length > 0 || choice.configurationId !== null;
  const formProblems = asked
    ? [
        choice.productIds.length < 2 ? 'Choose at least two boards.' : null,
        configuration === null ? 'Choose a load configuration.' : null,
      ].filter((p): p is string => p !== null)
    : [];
  const rowsFor = (c: Comparison) =>
    c.rows.map((row) => {
      const source = catalog.results.find(
        (r) =>
          r.productId === row.productId && r.roundupId === row.roundupId && r.configurationId === row.configurationId,
      );
      const model = models.find((m) => m.roundupId === row.roundupId);
      const product = model?.products.find((p) => p.productId === row.productId && p.kind === 'tested');
      const result = model?.results.find(
        (r) => r.entryId === product?.entryId && r.configurationId === row.configurationId,
      );
      return {
        name: row.productName,
        href: catalog.products.find((p) => p.productId === row.productId)?.path ?? '#',
        reference: false,
        valueC: row.deltaOverAmbientC,
        ...resultFigures(result),
        source: source ? { label: row.roundupTitle, href: source.path } : null,
      };
    });

  const body = html`<div class="compare">
    <h1>Compare boards</h1>
    <p class="standfirst">
      Pick published boards and one load configuration. We compare only like with like: the same CPU load and settings
      on the same test system, by the rise over the room, since rooms differ a little between roundups.
    </p>
    ${
      formProblems.length
        ? html`<div class="notice" role="alert">
            <p><strong>To compare:</strong></p>
            <ul>
              ${formProblems.map((p) => html`<li>${p}</li>`)}
            </ul>
          </div>`
        : ''
    }
    <form class="reader-form" method="get" action="${publicPaths.compare()}">
      <input type="hidden" name="unit" value="${unit}" />
      <fieldset>
        <legend>Boards</legend>
        ${catalog.products.length === 0 ? html`<p>No board is published yet.</p>` : ''}
        ${catalog.products.map(
          (p) =>
            html`<label class="check"
              ><input
                type="checkbox"
                name="product"
                value="${p.productId}"
                ${choice.productIds.includes(p.productId) ? 'checked' : ''}
              />
              ${p.name}</label
            >`,
        )}
      </fieldset>
      <div>
        <label for="compare-configuration">Load configuration</label>
        <select id="compare-configuration" name="configuration">
          <option value="">Choose a load…</option>
          ${catalog.configurations.map(
            (c) =>
              html`<option value="${c.id}" ${c.id === choice.configurationId ? 'selected' : ''}>
                ${c.name} (${watts(c.packagePowerW)})
              </option>`,
          )}
        </select>
      </div>
      <button type="submit">Compare</button>
    </form>
    ${
      comparison && configuration
        ? html`<section aria-labelledby="comparison-title">
            <h2 id="comparison-title">${configuration.name}</h2>
            <p>
              ${configuration.cpuDescription}; ${watts(configuration.packagePowerW)} package power;
              ${configuration.soakMinutes} min
              soak${comparison.benchProfileName ? html`; all measured on ${comparison.benchProfileName}` : ''}.
            </p>
            ${comparison.problem ? html`<p class="notice" role="status">${comparison.problem}</p>` : ''}
            ${
              comparison.rows.length > 0
                ? renderResultsChart(
                    {
                      id: 'compare',
                      title: `${configuration.name}: hottest VRM reading over the room`,
                      metric: 'over-ambient',
                      footnote: `Rise of the hottest VRM probe over the room temperature beside the system; ${configuration.soakMinutes} min soak; whiskers show the probe tolerance.`,
                      rows: rowsFor(comparison),
                      headingLevel: 3,
                      sourceColumn: 'Roundup',
                    },
                    unit,
                  )
                : ''
            }
            ${
              comparison.excluded.length
                ? html`<h3>Not compared</h3>
                    <ul class="excluded">
                      ${comparison.excluded.map((e) => html`<li><strong>${e.productName}</strong>: ${e.reason}</li>`)}
                    </ul>`
                : ''
            }
          </section>`
        : ''
    }
  </div>`;
  return renderPage(
    site,
    {
      title: configuration ? `Compare boards: ${configuration.name}` : 'Compare boards',
      description: 'Compare published VRM temperature results of motherboards, like for like.',
      path: publicPaths.compare(),
      ogType: 'website',
      query: options.query,
    },
    unit,
    body,
  );
}
