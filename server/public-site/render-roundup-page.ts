import { formatTemperature, type DisplayUnit } from '../../shared/domain/reader/temperature-display';
import { html, trustedHtml, type SafeHtml } from './html';
import { longDate, plusMinusTemperature, price, temperature, watts } from './format';
import type { PublishedProduct, PublishedResult, PublishedRoundup } from './published-roundup';
import { renderPage, type ReaderSite } from './render-layout';
import { renderResultsChart, resultFigures, type ChartRow } from './render-results-chart';
import { roundupJsonLd } from './json-ld';

const thinSpace = '\u2009';

/** The usual cautions of a VRM results page, deferring to the maker's limits and local rules (design notes). */
export function renderCautions(): SafeHtml {
  return html`<aside class="cautions" aria-labelledby="cautions-title">
    <h2 id="cautions-title">Before you copy our settings</h2>
    <ul>
      <li>Overclocking and raised voltages can shorten component life and void warranties.</li>
      <li>
        These results come from one open test system in a controlled room; a closed case in a warm room can run hotter.
      </li>
      <li>
        Power-delivery heatsinks and the rear of a board get hot enough to burn: let them cool before you touch them.
      </li>
      <li>Work on mains-powered equipment only when it is switched off and unplugged.</li>
      <li>Follow the maker's limits for your board and CPU, and your local electrical rules.</li>
    </ul>
  </aside>`;
}

export function productAnchor(entryId: number): string {
  return `board-${entryId}`;
}

export function resultFor(model: PublishedRoundup, entryId: number, configurationId: number) {
  return model.results.find((r) => r.entryId === entryId && r.configurationId === configurationId) ?? null;
}

function verdictBadge(result: PublishedResult | null): SafeHtml {
  if (!result) return html`<span class="verdict verdict-none">Not tested</span>`;
  if (!result.verdict || result.status === 'withheld')
    return html`<span class="verdict verdict-none">No verdict</span>`;
  const provisional = result.verdict.status === 'provisional';
  return html`<span class="verdict verdict-${result.verdict.code ?? 'none'}${provisional ? ' verdict-provisional' : ''}"
    >${result.verdict.label}</span
  >`;
}

/** Rows of one configuration's chart from the published results. */
export function chartRowsFor(
  model: PublishedRoundup,
  configurationId: number,
  metric: 'absolute' | 'over-ambient',
  hrefOf: (product: PublishedProduct) => string,
): ChartRow[] {
  return model.products.flatMap((product) => {
    const result = resultFor(model, product.entryId, configurationId);
    if (!result) return [];
    const valueC = metric === 'absolute' ? result.peakC : result.deltaOverAmbientC;
    return [
      {
        name: product.name,
        href: hrefOf(product),
        reference: product.kind === 'reference',
        valueC,
        ...resultFigures(result),
        notes:
          product.kind === 'reference' && product.reference
            ? [`From ${product.reference.title}.`, ...result.notes]
            : result.notes,
      },
    ];
  });
}

function roomRange(model: PublishedRoundup, configurationId: number, unit: DisplayUnit): string {
  const rooms = model.results
    .filter((r) => r.configurationId === configurationId && r.ambientC !== null)
    .map((r) => r.ambientC as number);
  if (rooms.length === 0) return '';
  const low = Math.min(...rooms);
  const high = Math.max(...rooms);
  const text = (c: number) => formatTemperature(c, unit, 'absolute');
  return low === high ? `Room ${text(low)}` : `Room ${text(low)} to ${text(high)}`;
}

function renderPicks(model: PublishedRoundup, unit: DisplayUnit): SafeHtml {
  const tested = model.products.filter((p) => p.kind === 'tested');
  const picks = model.picks
    .map((pick) => ({ pick, product: model.products.find((p) => p.entryId === pick.entryId) }))
    .filter((p): p is { pick: (typeof model.picks)[number]; product: PublishedProduct } => p.product !== undefined);
  void unit;
  return html`<section class="picks" aria-labelledby="picks-title">
    <h2 id="picks-title">The picks at a glance</h2>
    ${
      picks.length > 0
        ? html`<ul class="pick-list">
            ${picks.map(
              ({ pick, product }) =>
                html`<li>
                  <span class="pick-label">${pick.label}</span>
                  <a href="#${productAnchor(product.entryId)}">${product.name}</a>${
                    product.priceAtPublication
                      ? html` · ${price(product.priceAtPublication.amountMinor, product.priceAtPublication.currency)}`
                      : ''
                  }
                </li>`,
            )}
          </ul>`
        : ''
    }
    <div class="table-scroll">
      <table class="summary-table">
        <caption>
          Every board tested, with its label, its price when this page was published and its verdict under each load
        </caption>
        <thead>
          <tr>
            <th scope="col">Board</th>
            <th scope="col">Label</th>
            <th scope="col" class="num">Price at publication</th>
            ${model.configurations.map((c) => html`<th scope="col">${c.name}</th>`)}
          </tr>
        </thead>
        <tbody>
          ${tested.map(
            (product) =>
              html`<tr>
                <th scope="row"><a href="#${productAnchor(product.entryId)}">${product.name}</a></th>
                <td>${product.label ?? '—'}</td>
                <td class="num">
                  ${
                    product.priceAtPublication
                      ? price(product.priceAtPublication.amountMinor, product.priceAtPublication.currency)
                      : 'Not known'
                  }
                </td>
                ${model.configurations.map((c) => html`<td>${verdictBadge(resultFor(model, product.entryId, c.id))}</td>`)}
              </tr>`,
          )}
        </tbody>
      </table>
    </div>
    <p class="small">
      Prices are those we saw in ${model.region} on or before ${longDate(model.publishedAt)}; they change often.
    </p>
  </section>`;
}

function renderMethodology(model: PublishedRoundup, unit: DisplayUnit): SafeHtml {
  const profile = model.benchProfile;
  const rubric = model.rubric;
  return html`<section class="methodology" aria-labelledby="methodology-title">
    <h2 id="methodology-title">How we tested</h2>
    ${model.writeUp?.methodologyHtml ? html`<div class="write-up">${trustedHtml(model.writeUp.methodologyHtml)}</div>` : ''}
    ${
      profile
        ? html`<p>
              Every board was tested on the same open test system in a room held at
              ${temperature(profile.roomTargetC, unit)} ${plusMinusTemperature(profile.roomToleranceC, unit)}. Each load
              ran for at least ${profile.requiredSoakMinutes} minutes.
            </p>
            <dl class="facts">
              <dt>Probe</dt>
              <dd>${profile.probeType}</dd>
              <dt>Placement</dt>
              <dd>${profile.probePlacement}</dd>
              <dt>Case and fans</dt>
              <dd>${profile.caseAndFans}</dd>
              <dt>CPU cooler</dt>
              <dd>${profile.cooler}</dd>
              <dt>Power supply</dt>
              <dd>${profile.psu}</dd>
              <dt>Memory</dt>
              <dd>${profile.memory}</dd>
            </dl>`
        : ''
    }
    <div class="table-scroll">
      <table>
        <caption>
          Load configurations: the CPU and settings behind each chart
        </caption>
        <thead>
          <tr>
            <th scope="col">Load</th>
            <th scope="col">CPU</th>
            <th scope="col">Settings</th>
            <th scope="col" class="num">Package power</th>
            <th scope="col" class="num">Core voltage</th>
            <th scope="col" class="num">Soak</th>
          </tr>
        </thead>
        <tbody>
          ${model.configurations.map(
            (c) =>
              html`<tr>
                <th scope="row">${c.name}</th>
                <td>${c.cpuDescription}</td>
                <td>
                  ${
                    c.fixedClockMhz ? `Fixed ${c.fixedClockMhz} MHz` : 'Platform defaults'
                  }${c.settingsNotes ? html`. ${c.settingsNotes}` : ''}
                </td>
                <td class="num">${watts(c.packagePowerW)}</td>
                <td class="num">${c.coreVoltageV.toFixed(3)}${thinSpace}V</td>
                <td class="num">${c.soakMinutes}${thinSpace}min</td>
              </tr>`,
          )}
        </tbody>
      </table>
    </div>
    <p>
      We report the hottest reading of the power-delivery probes (filtered with a short moving median), the room
      temperature beside the system, and the rise over it. A run counts only when an editor checked its log and chose it
      as the run of record.${model.steadyStateRule ? html` Our settling rule: ${model.steadyStateRule}` : ''}
    </p>
    <p>
      Verdicts: below ${temperature(rubric.comfortableBelowC, unit)} is ${rubric.labels.comfortable}; up to
      ${temperature(rubric.warmUpToC, unit)} is ${rubric.labels.warm}; above that without the CPU slowing down is
      ${rubric.labels['hot-but-held']}; a run in which the CPU throttled is ${rubric.labels.throttled}, whatever its
      temperature. A verdict marked provisional comes from a soak that ended before it settled, judged on its predicted
      steady state; where the checks support no figure, none is shown.
    </p>
    <p>
      Each figure carries the tolerance of its thermocouple
      class${model.toleranceStandard ? html` (${model.toleranceStandard})` : ''}: two boards closer than their
      tolerances did not measurably differ.
    </p>
    <p><a href="#open-data">Download every run of record, the analysis settings and the rubric</a>.</p>
  </section>`;
}

function renderPowerDesign(product: PublishedProduct, unit: DisplayUnit): SafeHtml {
  void unit;
  const design = product.powerDesign;
  const row = (label: string, value: string | number | null) =>
    value === null || value === ''
      ? ''
      : html`<tr>
          <th scope="row">${label}</th>
          <td>${value}</td>
        </tr>`;
  const rows = [
    row('Controller', design.controller),
    row('Controller phases', design.controllerPhases),
    row('Phase arrangement', design.phaseMultiplication),
    row('Effective phases', design.effectivePhases),
    row('Stages per phase', design.stagesPerPhase),
    row('V-core stages', design.vcoreStageCount),
    row('Stage type', design.vcoreStageType),
    row('Stage part', design.vcoreStagePart),
    row('Stage rating', design.vcoreStageCurrentA === null ? null : `${design.vcoreStageCurrentA}\u2009A`),
    row(
      'Rated V-core current (sum of stage ratings)',
      design.vcoreRatedCurrentA === null ? null : `${design.vcoreRatedCurrentA}\u2009A`,
    ),
    row('SoC rail stages', design.socRailStages),
    row('Other rails', design.otherRails),
    row('Heatsinks', design.heatsinkNotes),
  ].filter((r) => r !== '');
  if (rows.length === 0) return html`<p>The maker has not published this board's power design.</p>`;
  return html`<div class="table-scroll">
    <table class="power-design">
      <caption>
        ${product.name}: power design
      </caption>
      <tbody>
        ${rows}
      </tbody>
    </table>
  </div>`;
}

export function renderPhoto(photo: PublishedProduct['photos'][number]): SafeHtml {
  const webp = photo.sources.filter((s) => s.format === 'webp');
  const jpeg = photo.sources.filter((s) => s.format === 'jpeg');
  const fallback = jpeg[Math.min(1, jpeg.length - 1)] ?? photo.sources[0];
  if (!fallback) return html``;
  const srcset = (list: typeof photo.sources) => list.map((s) => `${s.url} ${s.width}w`).join(', ');
  return html`<figure class="photo">
    <picture
      >${webp.length ? html`<source type="image/webp" srcset="${srcset(webp)}" sizes="(max-width: 48rem) 100vw, 44rem" />` : ''}<img
        src="${fallback.url}"
        ${jpeg.length ? html`srcset="${srcset(jpeg)}" sizes="(max-width: 48rem) 100vw, 44rem"` : ''}
        width="${fallback.width}"
        height="${fallback.height}"
        alt="${photo.altText}"
        loading="lazy"
        decoding="async"
    /></picture>
    ${photo.caption ? html`<figcaption>${photo.caption}</figcaption>` : ''}
  </figure>`;
}

function renderProductSection(model: PublishedRoundup, product: PublishedProduct, unit: DisplayUnit): SafeHtml {
  return html`<section
    class="product-section"
    id="${productAnchor(product.entryId)}"
    aria-labelledby="${productAnchor(product.entryId)}-title"
  >
    <h3 id="${productAnchor(product.entryId)}-title">
      ${product.name}${product.label ? html` <span class="pick-label">${product.label}</span>` : ''}
    </h3>
    <p class="product-facts">
      ${product.formFactor} · ${product.chipset} ·
      ${product.socket}${
        product.priceAtPublication
          ? html` · ${price(product.priceAtPublication.amountMinor, product.priceAtPublication.currency)} when published`
          : ''
      }${product.sample ? html` · Sample: ${product.sample.sourceLabel}` : ''}
    </p>
    ${product.reference ? html`<p>Shown for reference: tested in <a href="${product.reference.path}">${product.reference.title}</a>.</p>` : ''}
    ${product.writeUpHtml ? html`<div class="write-up">${trustedHtml(product.writeUpHtml)}</div>` : ''}
    <ul class="product-results">
      ${model.configurations.map((c) => {
        const result = resultFor(model, product.entryId, c.id);
        if (!result) return html`<li>${c.name}: not tested.</li>`;
        if (result.peakC === null) return html`<li>${c.name}: no figure reported. ${result.notes.join(' ')}</li>`;
        return html`<li>
          ${c.name}: peak
          ${temperature(result.peakC, unit)}${
            result.deltaOverAmbientC !== null
              ? html`, ${temperature(result.deltaOverAmbientC, unit, 'difference')} over the room`
              : ''
          }
          — ${verdictBadge(result)}${result.throttled ? html` <strong class="throttle-note">throttled</strong>` : ''}
        </li>`;
      })}
    </ul>
    ${product.photos.length ? html`<div class="photos">${product.photos.map(renderPhoto)}</div>` : ''}
    ${renderPowerDesign(product, unit)}
    <p><a href="${product.path}">Every published result of ${product.name}, and an estimate for your own system</a></p>
  </section>`;
}

function renderSamples(model: PublishedRoundup): SafeHtml {
  const tested = model.products.filter((p) => p.kind === 'tested');
  return html`<section class="samples" aria-labelledby="samples-title">
    <h2 id="samples-title">Where each sample came from</h2>
    <p>
      We say how we got every board: bought at retail like any reader, or lent by its maker. Makers never see results
      before publication.
    </p>
    <div class="table-scroll">
      <table>
        <caption>
          Source of each tested sample
        </caption>
        <thead>
          <tr>
            <th scope="col">Board</th>
            <th scope="col">Source</th>
            <th scope="col">Firmware on arrival</th>
          </tr>
        </thead>
        <tbody>
          ${tested.map(
            (p) =>
              html`<tr>
                <th scope="row">${p.name}</th>
                <td>${p.sample?.sourceLabel ?? 'Not recorded'}</td>
                <td>${p.sample?.firmwareOnArrival ?? '—'}</td>
              </tr>`,
          )}
        </tbody>
      </table>
    </div>
  </section>`;
}

function renderOpenData(model: PublishedRoundup): SafeHtml {
  const rawFiles = model.results.filter((r) => r.rawFile !== null);
  return html`<section class="open-data" id="open-data" aria-labelledby="open-data-title">
    <h2 id="open-data-title">Open data</h2>
    <p>Check our work: every figure on this page comes from these files.</p>
    <ul>
      <li>
        <a href="${model.openData.csvPath}" download>Results (CSV)</a>: every run of record, one row per board and load,
        units in the column names.
      </li>
      <li>
        <a href="${model.openData.analysisJsonPath}" download>Analysis settings and rubric (JSON)</a>: the parameters
        each run was analysed with and the verdict thresholds.
      </li>
      ${
        model.openData.rawFilesAllowed && rawFiles.length > 0
          ? html`<li>
              Raw logger files:
              <ul class="raw-files">
                ${rawFiles.map((r) => {
                  const product = model.products.find((p) => p.entryId === r.entryId);
                  const configuration = model.configurations.find((c) => c.id === r.configurationId);
                  return html`<li>
                    <a href="${r.rawFile?.path}" download
                      >${product?.name ?? 'Board'}, ${configuration?.name ?? 'load'}</a
                    >
                  </li>`;
                })}
              </ul>
            </li>`
          : html`<li>The raw logger files of this roundup are not published.</li>`
      }
    </ul>
    <p class="licence">${model.openData.licence}</p>
  </section>`;
}

function renderCorrections(model: PublishedRoundup): SafeHtml {
  return html`<section class="corrections" aria-labelledby="corrections-title">
    <h2 id="corrections-title">Corrections and updates</h2>
    ${
      model.corrections.length === 0
        ? html`<p>No corrections or updates since this page was published on ${longDate(model.publishedAt)}.</p>`
        : html`<ol class="correction-log">
            ${model.corrections.map(
              (c) =>
                html`<li>
                  <time datetime="${c.at}">${longDate(c.at)}</time> —
                  <strong>${c.kind === 'correction' ? 'Correction' : 'Update'}:</strong> ${c.note}
                </li>`,
            )}
          </ol>`
    }
  </section>`;
}

export interface RenderRoundupPageOptions {
  unit: DisplayUnit;
}

/** The results page of a published roundup, as a complete HTML document. */
export function renderRoundupPage(
  site: ReaderSite,
  model: PublishedRoundup,
  options: RenderRoundupPageOptions,
): string {
  const { unit } = options;
  const tested = model.products.filter((p) => p.kind === 'tested');
  const reference = model.products.filter((p) => p.kind === 'reference');
  const charts = model.configurations.map((configuration) =>
    renderResultsChart(
      {
        id: `c${configuration.id}`,
        title: `${configuration.name}: hottest VRM reading, absolute`,
        metric: 'absolute',
        footnote:
          [
            roomRange(model, configuration.id, unit),
            `soak ${configuration.soakMinutes} min`,
            `package power about ${watts(configuration.packagePowerW)}`,
            'whiskers show the probe tolerance',
          ]
            .filter(Boolean)
            .join('; ')
            .replace(/^./, (c) => c.toUpperCase()) + '.',
        rows: chartRowsFor(model, configuration.id, 'absolute', (p) => `#${productAnchor(p.entryId)}`),
        headingLevel: 3,
      },
      unit,
    ),
  );
  const updated = model.updatedAt !== model.publishedAt;
  const body = html`<article class="roundup" aria-labelledby="headline">
    <header class="roundup-header">
      <p class="kicker">
        ${model.platform} · ${model.category} · ${price(model.priceBand.minMinor, model.priceBand.currency)} to
        ${price(model.priceBand.maxMinor, model.priceBand.currency)}
      </p>
      <h1 id="headline">${model.headline}</h1>
      ${model.standfirst ? html`<p class="standfirst">${model.standfirst}</p>` : ''}
      <p class="dateline">
        Published <time datetime="${model.publishedAt}">${longDate(model.publishedAt)}</time>${
          updated
            ? html` · Updated <time datetime="${model.updatedAt}">${longDate(model.updatedAt)}</time> (<a
                  href="#corrections-title"
                  >what changed</a
                >)`
            : ''
        }
        · ${tested.length} boards tested${reference.length ? `, ${reference.length} shown for reference` : ''}
      </p>
    </header>
    ${
      model.writeUp?.introductionHtml
        ? html`<section class="write-up" aria-label="Introduction">
            ${trustedHtml(model.writeUp.introductionHtml)}
          </section>`
        : ''
    }
    ${renderPicks(model, unit)} ${renderCautions()} ${renderMethodology(model, unit)}
    <section class="results" aria-labelledby="results-title">
      <h2 id="results-title">Results</h2>
      <p>
        One chart per load, best first. Bars in copper are this roundup's
        boards${reference.length ? ', muted bars are boards from earlier roundups' : ''}; a hatched bar marks a run in
        which the CPU throttled.
      </p>
      ${charts}
    </section>
    <section class="boards" aria-labelledby="boards-title">
      <h2 id="boards-title">The boards</h2>
      ${model.products.map((p) => renderProductSection(model, p, unit))}
    </section>
    ${
      model.writeUp?.conclusionHtml
        ? html`<section class="write-up" aria-labelledby="conclusion-title">
            <h2 id="conclusion-title">Our conclusion</h2>
            ${trustedHtml(model.writeUp.conclusionHtml)}
          </section>`
        : ''
    }
    ${renderSamples(model)} ${renderOpenData(model)} ${renderCorrections(model)}
  </article>`;
  const chartImage = model.chartImages[0];
  return renderPage(
    site,
    {
      title: model.headline,
      description:
        model.standfirst ??
        `${tested.length} ${model.platform} boards tested for power-delivery temperatures under ${model.configurations.length} loads, with every run as open data.`,
      path: model.path,
      ogType: 'article',
      ogImage: chartImage
        ? {
            url: chartImage.url,
            width: chartImage.width,
            height: chartImage.height,
            alt: `Chart of the hottest VRM readings under ${model.configurations.find((c) => c.id === chartImage.configurationId)?.name ?? 'the first load'}`,
          }
        : null,
      jsonLd: roundupJsonLd(site, model),
    },
    unit,
    body,
  );
}
