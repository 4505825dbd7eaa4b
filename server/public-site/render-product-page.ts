import type { DisplayUnit } from '../../shared/domain/reader/temperature-display';
import { estimateVrmPeak, type EstimatePoint, type VrmEstimate } from '../../shared/domain/reader/vrm-estimate';
import { html, type SafeHtml } from './html';
import { longDate, price, temperature, watts } from './format';
import { offerJsonLd, outletJsonLd, productNode, reviewRatingJsonLd } from './json-ld';
import type { PublishedProduct, PublishedResult, PublishedRoundup } from './published-roundup';
import { absoluteUrl, renderPage, type ReaderSite } from './render-layout';
import { productAnchor, renderPhoto } from './render-roundup-page';

export interface ProductAppearance {
  model: PublishedRoundup;
  product: PublishedProduct;
  results: PublishedResult[];
}

/** Every published roundup a board appears in (tested or for reference), newest first. */
export function productAppearances(models: readonly PublishedRoundup[], productId: number): ProductAppearance[] {
  return models.flatMap((model) =>
    model.products
      .filter((p) => p.productId === productId)
      .map((product) => ({
        model,
        product,
        results: model.results.filter((r) => r.entryId === product.entryId),
      })),
  );
}

/**
 * The measured points the estimate may use: runs of this board in roundups that tested it (a reference entry repeats
 * an earlier run, so it is not counted twice), with a final verdict, a figure, and no throttle (a throttled run's
 * temperature is held down by the CPU slowing, not by the board).
 */
export function estimatePointsFor(appearances: readonly ProductAppearance[]): EstimatePoint[] {
  return appearances
    .filter((a) => a.product.kind === 'tested')
    .flatMap((a) =>
      a.results
        .filter(
          (r) =>
            r.status === 'measured' && r.verdict?.status === 'final' && !r.throttled && r.deltaOverAmbientC !== null,
        )
        .map((r) => ({
          packagePowerW: a.model.configurations.find((c) => c.id === r.configurationId)?.packagePowerW ?? NaN,
          deltaOverAmbientC: r.deltaOverAmbientC as number,
          toleranceC: r.toleranceC,
        }))
        .filter((p) => Number.isFinite(p.packagePowerW)),
    );
}

export interface EstimateForm {
  /** As typed, kept on errors. */
  power: string;
  room: string;
  errors: { power?: string; room?: string };
  /** Set when both inputs were valid. */
  estimate: VrmEstimate | null;
  /** The room in °C the estimate used. */
  roomC: number | null;
}

/** Reads and checks the estimate form's GET fields; the room is typed in the reader's unit. */
export function readEstimateForm(
  query: { power?: unknown; room?: unknown },
  unit: DisplayUnit,
  points: readonly EstimatePoint[],
): EstimateForm | null {
  const power = typeof query.power === 'string' ? query.power.trim().slice(0, 20) : '';
  const room = typeof query.room === 'string' ? query.room.trim().slice(0, 20) : '';
  if (power === '' && room === '') return null;
  const errors: EstimateForm['errors'] = {};
  const powerW = Number(power.replace(',', '.'));
  if (power === '') errors.power = 'Enter your CPU package power in watts, for example 230.';
  else if (!Number.isFinite(powerW) || powerW < 10 || powerW > 1000)
    errors.power = 'Enter a package power between 10 and 1000 W.';
  const roomValue = Number(room.replace(',', '.'));
  const [low, high] = unit === 'F' ? [41, 113] : [5, 45];
  if (room === '') errors.room = `Enter your room temperature in °${unit}, for example ${unit === 'F' ? 72 : 22}.`;
  else if (!Number.isFinite(roomValue) || roomValue < low || roomValue > high)
    errors.room = `Enter a room temperature between ${low} and ${high} °${unit}.`;
  if (errors.power || errors.room) return { power, room, errors, estimate: null, roomC: null };
  const roomC = unit === 'F' ? ((roomValue - 32) * 5) / 9 : roomValue;
  return { power, room, errors, roomC, estimate: estimateVrmPeak(points, { packagePowerW: powerW, roomC }) };
}

function renderEstimateResult(form: EstimateForm, unit: DisplayUnit, name: string): SafeHtml {
  const estimate = form.estimate;
  if (!estimate) return html``;
  if (estimate.status === 'not-enough-points') {
    return html`<div class="estimate-result" role="status"><p>${estimate.reason}</p></div>`;
  }
  return html`<div class="estimate-result" role="status" aria-labelledby="estimate-result-title">
    <h3 id="estimate-result-title">Estimated hottest VRM reading for ${name}</h3>
    <p class="estimate-figure">
      ${temperature(estimate.estimateC, unit)}
      <span class="small">(${temperature(estimate.lowC, unit)} to ${temperature(estimate.highC, unit)})</span>
    </p>
    <p>
      From ${estimate.pointCount} published measurements: the line through them predicts
      ${temperature(estimate.predictedDeltaC, unit, 'difference')} over a room at ${temperature(form.roomC ?? 0, unit)}
      (${temperature(estimate.slopeCPerW * 10, unit, 'difference')} more for every 10 W more). The band adds
      ${
        estimate.statisticalBandC === null
          ? 'no statistical spread (two points fix a line exactly, so they cannot show how far off it may be)'
          : html`${temperature(estimate.statisticalBandC, unit, 'difference')} for the scatter of the points (95 %
            prediction interval)`
      }
      and
      ${estimate.toleranceC === null ? 'no probe tolerance (not known)' : html`${temperature(estimate.toleranceC, unit, 'difference')} for the probe tolerance`}.
    </p>
    ${
      estimate.extrapolated
        ? html`<p class="notice">
            <strong>Outside what we tested.</strong> We measured this board from ${watts(estimate.testedRangeW.min)} to
            ${watts(estimate.testedRangeW.max)}; ${form.power} W is ${estimate.extrapolated} that range, so this figure
            extends the line beyond our measurements and may be further off than the band says.
          </p>`
        : ''
    }
  </div>`;
}

function renderEstimate(
  product: PublishedProduct,
  path: string,
  form: EstimateForm | null,
  unit: DisplayUnit,
  pointCount: number,
): SafeHtml {
  const powerError = form?.errors.power;
  const roomError = form?.errors.room;
  return html`<section class="estimate" id="estimate" aria-labelledby="estimate-title">
    <h2 id="estimate-title">Will it cope in your system?</h2>
    <p>
      Enter your CPU's package power and your room temperature for an estimate of this board's hottest VRM reading, from
      ${pointCount} published measurements.
    </p>
    <ul class="small">
      <li>This is an estimate, not a guarantee: it comes from our open test system.</li>
      <li>Cases and airflow differ: a closed case with little airflow runs hotter.</li>
      <li>Follow the maker's limits for your board and CPU.</li>
    </ul>
    <form class="reader-form" method="get" action="${path}#estimate" novalidate>
      <input type="hidden" name="unit" value="${unit}" />
      <div>
        <label for="estimate-power">CPU package power (W)</label>
        <input
          id="estimate-power"
          name="power"
          type="number"
          inputmode="decimal"
          min="10"
          max="1000"
          step="any"
          value="${form?.power ?? ''}"
          ${powerError ? html`aria-invalid="true" aria-describedby="estimate-power-error"` : html`aria-describedby="estimate-power-hint"`}
        />
        <p class="hint" id="estimate-power-hint">What your monitoring tool shows under your heaviest load.</p>
        ${powerError ? html`<p class="field-error" id="estimate-power-error">${powerError}</p>` : ''}
      </div>
      <div>
        <label for="estimate-room">Room temperature (°${unit})</label>
        <input
          id="estimate-room"
          name="room"
          type="number"
          inputmode="decimal"
          step="any"
          value="${form?.room ?? ''}"
          ${roomError ? html`aria-invalid="true" aria-describedby="estimate-room-error"` : ''}
        />
        ${roomError ? html`<p class="field-error" id="estimate-room-error">${roomError}</p>` : ''}
      </div>
      <button type="submit">Estimate</button>
    </form>
    ${form ? renderEstimateResult(form, unit, product.name) : ''}
  </section>`;
}

function productJsonLd(site: ReaderSite, appearances: readonly ProductAppearance[], latest: PublishedProduct) {
  const outlet = outletJsonLd(site);
  // The price at the latest publication that knew one.
  const priced = [latest, ...appearances.map((a) => a.product)].find((p) => p.priceAtPublication);
  const offer = priced ? offerJsonLd(priced, absoluteUrl(site, latest.path)) : null;
  return {
    '@context': 'https://schema.org',
    ...productNode(site, latest, offer),
    review: appearances
      .filter((a) => a.product.kind === 'tested')
      .map((a) => ({
        '@type': 'Review',
        name: `${latest.name} in ${a.model.headline}`,
        url: `${absoluteUrl(site, a.model.path)}#${productAnchor(a.product.entryId)}`,
        datePublished: a.model.publishedAt,
        author: outlet,
        ...reviewRatingJsonLd(a.product.label),
      })),
  };
}

/** A board's page: every published result across roundups, its power design and photos, and the estimate form. */
export function renderProductPage(
  site: ReaderSite,
  appearances: readonly ProductAppearance[],
  options: { unit: DisplayUnit; estimate: EstimateForm | null; pointCount: number; query?: URLSearchParams },
): string {
  const { unit } = options;
  const latest = (appearances.find((a) => a.product.kind === 'tested') ?? appearances[0]).product;
  const tested = appearances.filter((a) => a.product.kind === 'tested');
  const photos = tested.find((a) => a.product.photos.length > 0)?.product.photos ?? [];
  const body = html`<div class="product-page">
    <header>
      <p class="kicker">${latest.maker} · ${latest.formFactor} · ${latest.chipset} · ${latest.socket}</p>
      <h1>${latest.name}</h1>
      <p class="dateline">Tested in ${tested.length} published ${tested.length === 1 ? 'roundup' : 'roundups'}.</p>
    </header>
    <section aria-labelledby="history-title">
      <h2 id="history-title">Every published result</h2>
      <div class="table-scroll">
        <table>
          <caption>
            ${latest.name}: runs of record in each roundup, by load
          </caption>
          <thead>
            <tr>
              <th scope="col">Roundup</th>
              <th scope="col">Load</th>
              <th scope="col" class="num">Package power</th>
              <th scope="col" class="num">Peak</th>
              <th scope="col" class="num">Room</th>
              <th scope="col" class="num">Over ambient</th>
              <th scope="col">Verdict</th>
              <th scope="col">Label</th>
            </tr>
          </thead>
          <tbody>
            ${appearances.flatMap((a) =>
              a.model.configurations.map((c) => {
                const r = a.results.find((x) => x.configurationId === c.id);
                return html`<tr>
                  <th scope="row">
                    <a href="${a.model.path}#${productAnchor(a.product.entryId)}">${a.model.headline}</a>
                    <span class="small">${longDate(a.model.publishedAt)}</span>${
                      a.product.kind === 'reference' ? html` <span class="tag">reference</span>` : ''
                    }
                  </th>
                  <td>${c.name}</td>
                  <td class="num">${watts(c.packagePowerW)}</td>
                  <td class="num">${r?.peakC != null ? temperature(r.peakC, unit) : '—'}</td>
                  <td class="num">${r?.ambientC != null ? temperature(r.ambientC, unit) : '—'}</td>
                  <td class="num">
                    ${r?.deltaOverAmbientC != null ? temperature(r.deltaOverAmbientC, unit, 'difference') : '—'}
                  </td>
                  <td>
                    ${
                      !r
                        ? 'Not tested'
                        : r.verdict && r.status === 'measured'
                          ? html`<span
                                class="verdict verdict-${r.verdict.code ?? 'none'}${
                                  r.verdict.status === 'provisional' ? ' verdict-provisional' : ''
                                }"
                                >${r.verdict.label}</span
                              >${r.throttled ? html` <strong class="throttle-note">throttled</strong>` : ''}`
                          : 'No figure'
                    }
                  </td>
                  <td>${a.product.label ?? '—'}</td>
                </tr>`;
              }),
            )}
          </tbody>
        </table>
      </div>
      ${
        latest.priceAtPublication
          ? html`<p class="small">
              Price when last published:
              ${price(latest.priceAtPublication.amountMinor, latest.priceAtPublication.currency)} (seen
              ${latest.priceAtPublication.observedOn}).
            </p>`
          : ''
      }
    </section>
    ${renderEstimate(latest, latest.path, options.estimate, unit, options.pointCount)}
    ${
      photos.length
        ? html`<section aria-labelledby="photos-title">
            <h2 id="photos-title">Photos</h2>
            <div class="photos">${photos.map(renderPhoto)}</div>
          </section>`
        : ''
    }
    <section aria-labelledby="design-title">
      <h2 id="design-title">Power design</h2>
      <dl class="facts">
        ${Object.entries({
          Controller: latest.powerDesign.controller,
          'Effective phases': latest.powerDesign.effectivePhases,
          'Phase arrangement': latest.powerDesign.phaseMultiplication,
          'V-core stages': latest.powerDesign.vcoreStageCount,
          'Stage rating':
            latest.powerDesign.vcoreStageCurrentA === null ? null : `${latest.powerDesign.vcoreStageCurrentA} A`,
          Heatsinks: latest.powerDesign.heatsinkNotes,
        })
          .filter(([, value]) => value !== null && value !== '')
          .map(
            ([label, value]) =>
              html`<dt>${label}</dt>
                <dd>${value}</dd>`,
          )}
      </dl>
    </section>
  </div>`;
  return renderPage(
    site,
    {
      title: latest.name,
      description: `Published VRM temperature results of the ${latest.name} across roundups, with an estimate for your own system.`,
      path: latest.path,
      ogType: 'website',
      jsonLd: productJsonLd(site, appearances, latest),
      query: options.query,
    },
    unit,
    body,
  );
}
