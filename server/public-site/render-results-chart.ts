import { formatTemperature, type DisplayUnit } from '../../shared/domain/reader/temperature-display';
import { html, type SafeHtml } from './html';
import { plusMinusTemperature, temperature } from './format';
import type { PublishedResult } from './published-roundup';

/** One bar of a results chart: a board's run of record under one load configuration. */
export interface ChartRow {
  name: string;
  /** Link to the board's section or page. */
  href: string;
  /** This roundup's board (accent) or a reference board from an earlier roundup (muted). */
  reference: boolean;
  /** The charted figure in °C (absolute peak, or rise over ambient); null: no figure is reported. */
  valueC: number | null;
  peakC: number | null;
  ambientC: number | null;
  deltaOverAmbientC: number | null;
  toleranceC: number | null;
  throttled: boolean;
  verdictLabel: string | null;
  verdictCode: string | null;
  provisional: boolean;
  manual: boolean;
  notes: string[];
  /** Extra leading cell (the roundup a compared result comes from). */
  source?: { label: string; href: string } | null;
}

/** A row's figures, verdict and notes from the published result it shows; none where that result is missing. */
export function resultFigures(
  result: PublishedResult | null | undefined,
): Omit<ChartRow, 'name' | 'href' | 'reference' | 'valueC' | 'source'> {
  return {
    peakC: result?.peakC ?? null,
    ambientC: result?.ambientC ?? null,
    deltaOverAmbientC: result?.deltaOverAmbientC ?? null,
    toleranceC: result?.toleranceC ?? null,
    throttled: result?.throttled ?? false,
    verdictLabel: result?.verdict?.label ?? null,
    verdictCode: result?.verdict?.code ?? null,
    provisional: result?.verdict?.status === 'provisional',
    manual: result?.manual ?? false,
    notes: result?.notes ?? [],
  };
}

export interface ChartSpec {
  /** Unique within the page: used for element ids. */
  id: string;
  title: string;
  metric: 'absolute' | 'over-ambient';
  footnote: string;
  rows: ChartRow[];
  /** Heading level of the chart's title inside its section. */
  headingLevel: 2 | 3;
  sourceColumn?: string;
}

/** Best to worst: lowest figure first; throttled runs after every run that held; runs with no figure last. */
export function sortChartRows(rows: ChartRow[]): ChartRow[] {
  const rank = (row: ChartRow) => (row.valueC === null ? 2 : row.throttled ? 1 : 0);
  return [...rows].sort(
    (a, b) => rank(a) - rank(b) || (a.valueC ?? 0) - (b.valueC ?? 0) || a.name.localeCompare(b.name),
  );
}

const barHeight = 26;
const gap = 10;
const labelWidth = 210;
const plotWidth = 300;
const valueWidth = 170;

/**
 * The chart as a static SVG drawn on the server, so it shows without JavaScript; the reader script draws the
 * interactive chart from the table and hides this one. Screen readers get the table, so the SVG is hidden from them.
 */
function staticBars(spec: ChartSpec, rows: ChartRow[], unit: DisplayUnit): SafeHtml {
  const charted = rows.filter((r) => r.valueC !== null);
  if (charted.length === 0) return html``;
  const maxC = Math.max(...charted.map((r) => (r.valueC as number) + (r.toleranceC ?? 0)), 1);
  const scale = plotWidth / (maxC * 1.05);
  const height = charted.length * (barHeight + gap) + gap;
  const hatchId = `hatch-${spec.id}`;
  const kind = spec.metric === 'absolute' ? 'absolute' : 'difference';
  return html`<svg
    class="static-chart"
    viewBox="0 0 ${labelWidth + plotWidth + valueWidth} ${height}"
    width="100%"
    aria-hidden="true"
    focusable="false"
  >
    <defs>
      <pattern id="${hatchId}" width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
        <rect width="8" height="8" class="bar-throttled-fill" />
        <line x1="0" y1="0" x2="0" y2="8" class="hatch-line" />
      </pattern>
    </defs>
    ${charted.map((row, index) => {
      const y = gap + index * (barHeight + gap);
      const width = Math.max(2, (row.valueC as number) * scale);
      const whisker = row.toleranceC !== null ? row.toleranceC * scale : 0;
      const barClass = row.throttled ? 'bar bar-throttled' : row.reference ? 'bar bar-reference' : 'bar bar-roundup';
      const label = row.name.length > 30 ? `${row.name.slice(0, 29)}…` : row.name;
      const value = formatTemperature(row.valueC as number, unit, kind);
      return html`<g>
        <text x="${labelWidth - 8}" y="${y + barHeight / 2 + 5}" text-anchor="end" class="bar-label">${label}</text>
        <rect
          x="${labelWidth}"
          y="${y}"
          width="${width.toFixed(1)}"
          height="${barHeight}"
          class="${barClass}"
          ${row.throttled ? html` fill="url(#${hatchId})"` : ''}
        />
        ${
          whisker > 0
            ? html`<line
                x1="${(labelWidth + width - whisker).toFixed(1)}"
                x2="${(labelWidth + width + whisker).toFixed(1)}"
                y1="${y + barHeight / 2}"
                y2="${y + barHeight / 2}"
                class="whisker"
              />`
            : ''
        }
        <text x="${(labelWidth + width + whisker + 6).toFixed(1)}" y="${y + barHeight / 2 + 5}" class="bar-value"
          ><tspan class="temp" data-c="${row.valueC}" data-kind="${kind}">${value}</tspan>${
            row.throttled ? ' throttled' : row.provisional ? ' provisional' : ''
          }</text
        >
      </g>`;
    })}
  </svg>`;
}

function verdictCell(row: ChartRow): SafeHtml {
  if (row.verdictLabel === null) return html`<td>—</td>`;
  const code = row.verdictCode ?? 'none';
  return html`<td>
    <span class="verdict verdict-${code}${row.provisional ? ' verdict-provisional' : ''}">${row.verdictLabel}</span>
  </td>`;
}

/** A results chart and its data table (the table is the chart's source and its accessible form). */
export function renderResultsChart(spec: ChartSpec, unit: DisplayUnit): SafeHtml {
  const rows = sortChartRows(spec.rows);
  const titleId = `chart-title-${spec.id}`;
  const heading =
    spec.headingLevel === 2
      ? html`<h2 id="${titleId}">${spec.title}</h2>`
      : html`<h3 id="${titleId}">${spec.title}</h3>`;
  const figureLabel = spec.metric === 'absolute' ? 'Peak' : 'Rise over ambient';
  return html`<figure
    class="results-chart"
    id="chart-${spec.id}"
    data-chart="results"
    data-metric="${spec.metric}"
    aria-labelledby="${titleId}"
  >
    ${heading}
    <div class="chart-area">${staticBars(spec, rows, unit)}</div>
    <div class="table-scroll">
      <table class="results-table">
        <caption>
          ${spec.title}: the figures behind the chart, best first
        </caption>
        <thead>
          <tr>
            ${spec.sourceColumn ? html`<th scope="col">${spec.sourceColumn}</th>` : ''}
            <th scope="col">Board</th>
            <th scope="col" class="num">${figureLabel}</th>
            ${spec.metric === 'absolute' ? '' : html`<th scope="col" class="num">Peak</th>`}
            <th scope="col" class="num">Room</th>
            ${spec.metric === 'absolute' ? html`<th scope="col" class="num">Over ambient</th>` : ''}
            <th scope="col" class="num">Probe tolerance</th>
            <th scope="col">Verdict</th>
            <th scope="col">Notes</th>
          </tr>
        </thead>
        <tbody>
          ${rows.map(
            (row) =>
              html`<tr
                data-name="${row.name}"
                data-value-c="${row.valueC ?? ''}"
                data-tolerance-c="${row.toleranceC ?? ''}"
                data-throttled="${row.throttled}"
                data-reference="${row.reference}"
                data-provisional="${row.provisional}"
              >
                ${row.source !== undefined ? html`<td>${row.source ? html`<a href="${row.source.href}">${row.source.label}</a>` : '—'}</td>` : ''}
                <th scope="row">
                  <a href="${row.href}">${row.name}</a>${row.reference ? html` <span class="tag">reference</span>` : ''}
                </th>
                <td class="num">
                  ${row.valueC === null ? 'No figure' : temperature(row.valueC, unit, spec.metric === 'absolute' ? 'absolute' : 'difference')}${
                    row.manual ? html`<span class="marker" title="Entered by hand"> (by hand)</span>` : ''
                  }
                </td>
                ${
                  spec.metric === 'absolute'
                    ? ''
                    : html`<td class="num">${row.peakC === null ? '—' : temperature(row.peakC, unit)}</td>`
                }
                <td class="num">${row.ambientC === null ? '—' : temperature(row.ambientC, unit)}</td>
                ${
                  spec.metric === 'absolute'
                    ? html`<td class="num">
                        ${row.deltaOverAmbientC === null ? '—' : temperature(row.deltaOverAmbientC, unit, 'difference')}
                      </td>`
                    : ''
                }
                <td class="num">${row.toleranceC === null ? '—' : plusMinusTemperature(row.toleranceC, unit)}</td>
                ${verdictCell(row)}
                <td>
                  ${row.throttled ? html`<strong class="throttle-note">Throttled: the CPU slowed to protect itself.</strong> ` : ''}${row.notes.join(' ')}
                </td>
              </tr>`,
          )}
        </tbody>
      </table>
    </div>
    <figcaption class="chart-footnote">${spec.footnote}</figcaption>
  </figure>`;
}
