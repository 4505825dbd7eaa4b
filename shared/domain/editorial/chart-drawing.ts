import type { ChartConfiguration, Plugin } from 'chart.js';
import type { BarChartData, ChartData, ChartValue, ScatterChartData } from './chart-data';
import { lightChartPalette, type ChartPalette } from './chart-palette';
import { minorUnitDigits } from '../planning/money';

// How a chart's data becomes a chart.js configuration, the same in the app (react-chartjs-2) and on the server
// (@napi-rs/canvas): colours from the Benchwire palette, hatching and the words "Throttled" on throttled runs, values
// and marks printed at the bar ends, and the thermocouple tolerance as thin dark whiskers. Everything is drawn by
// one plugin with plain canvas calls, so both renderers produce the same picture.

/** The size of chart images for e-mail and social previews (1200 × 630, the common large-preview size). */
export const chartImageSize = { width: 1200, height: 630 } as const;

export interface DrawingOptions {
  palette?: ChartPalette;
  fontFamily?: string;
  /** False for images (server PNG): no animation, no resizing. */
  interactive?: boolean;
}

const hatchSpacing = 7;

interface Box {
  left: number;
  right: number;
  top: number;
  bottom: number;
}

type Ctx = CanvasRenderingContext2D;

function hatch(ctx: Ctx, box: Box, colour: string) {
  ctx.save();
  ctx.beginPath();
  ctx.rect(box.left, box.top, box.right - box.left, box.bottom - box.top);
  ctx.clip();
  ctx.strokeStyle = colour;
  ctx.lineWidth = 2;
  const height = box.bottom - box.top;
  for (let x = box.left - height; x < box.right; x += hatchSpacing) {
    ctx.beginPath();
    ctx.moveTo(x, box.bottom);
    ctx.lineTo(x + height, box.top);
    ctx.stroke();
  }
  ctx.restore();
}

function whisker(ctx: Ctx, from: number, to: number, at: number, cap: number, vertical: boolean, colour: string) {
  ctx.save();
  ctx.strokeStyle = colour;
  ctx.lineWidth = 1.5;
  ctx.beginPath();
  if (vertical) {
    ctx.moveTo(at, from);
    ctx.lineTo(at, to);
    ctx.moveTo(at - cap, from);
    ctx.lineTo(at + cap, from);
    ctx.moveTo(at - cap, to);
    ctx.lineTo(at + cap, to);
  } else {
    ctx.moveTo(from, at);
    ctx.lineTo(to, at);
    ctx.moveTo(from, at - cap);
    ctx.lineTo(from, at + cap);
    ctx.moveTo(to, at - cap);
    ctx.lineTo(to, at + cap);
  }
  ctx.stroke();
  ctx.restore();
}

function valueLabel(value: ChartValue): string {
  return [value.valueText, ...value.marks].join(' · ');
}

function colourOf(value: ChartValue, palette: ChartPalette): string {
  if (value.throttled) return palette.throttled;
  return value.role === 'reference' ? palette.reference : palette.roundup;
}

/** Hatching, whiskers and printed values for a horizontal bar chart. */
function barMarksPlugin(chart: BarChartData, palette: ChartPalette, fontFamily: string): Plugin<'bar'> {
  return {
    id: 'benchwireBarMarks',
    afterDatasetsDraw(instance) {
      const ctx = instance.ctx as unknown as Ctx;
      const meta = instance.getDatasetMeta(0);
      const x = instance.scales.x;
      meta.data.forEach((element, index) => {
        const value = chart.bars[index];
        if (!value) return;
        const bar = element as unknown as { x: number; y: number; base: number; height: number };
        const box = {
          left: Math.min(bar.base, bar.x),
          right: Math.max(bar.base, bar.x),
          top: bar.y - bar.height / 2,
          bottom: bar.y + bar.height / 2,
        };
        if (value.throttled) hatch(ctx, box, palette.background);
        let end = box.right;
        if (value.whiskerC !== null) {
          const low = x.getPixelForValue(value.value - value.whiskerC);
          const high = x.getPixelForValue(value.value + value.whiskerC);
          whisker(ctx, low, high, bar.y, Math.min(6, bar.height / 3), false, palette.ink);
          end = Math.max(end, high);
        }
        ctx.save();
        ctx.fillStyle = palette.ink;
        ctx.font = `600 13px ${fontFamily}`;
        ctx.textBaseline = 'middle';
        ctx.textAlign = 'left';
        ctx.fillText(valueLabel(value), end + 6, bar.y);
        ctx.restore();
      });
    },
  };
}

/** Whiskers, crosses for throttled points and product labels for the price scatter. */
function scatterMarksPlugin(chart: ScatterChartData, palette: ChartPalette, fontFamily: string): Plugin<'scatter'> {
  return {
    id: 'benchwireScatterMarks',
    afterDatasetsDraw(instance) {
      const ctx = instance.ctx as unknown as Ctx;
      const y = instance.scales.y;
      const meta = instance.getDatasetMeta(0);
      meta.data.forEach((element, index) => {
        const point = chart.points[index];
        if (!point) return;
        const at = element as unknown as { x: number; y: number };
        if (point.whiskerC !== null) {
          whisker(
            ctx,
            y.getPixelForValue(point.value - point.whiskerC),
            y.getPixelForValue(point.value + point.whiskerC),
            at.x,
            5,
            true,
            palette.ink,
          );
        }
        ctx.save();
        ctx.fillStyle = palette.ink;
        ctx.font = `600 12px ${fontFamily}`;
        ctx.textBaseline = 'middle';
        ctx.textAlign = 'left';
        ctx.fillText(`${point.label}: ${valueLabel(point)}`, at.x + 10, at.y);
        ctx.restore();
      });
    },
  };
}

function legendItem(text: string, fill: string, stroke: string, fontColor: string) {
  return { text, fillStyle: fill, strokeStyle: stroke, lineWidth: 1, hidden: false, fontColor };
}

/** The legend above a chart, listing `items`; clicking it hides nothing. */
function legend(palette: ChartPalette, fontFamily: string, items: () => ReturnType<typeof legendItem>[]) {
  return {
    display: true,
    position: 'top' as const,
    labels: { color: palette.ink, font: { size: 12, family: fontFamily }, generateLabels: items },
    onClick: () => undefined,
  };
}

function common(chart: ChartData, palette: ChartPalette, fontFamily: string, interactive: boolean) {
  return {
    responsive: interactive,
    maintainAspectRatio: false,
    animation: false as const,
    devicePixelRatio: interactive ? undefined : 1,
    layout: { padding: { top: 8, right: 24, bottom: 8, left: 8 } },
    font: { family: fontFamily },
    color: palette.ink,
    plugins: {
      title: {
        display: true,
        text: chart.title,
        color: palette.ink,
        font: { size: 16, weight: 'bold' as const, family: fontFamily },
      },
      subtitle: {
        display: true,
        text: chart.footnote,
        position: 'bottom' as const,
        align: 'start' as const,
        color: palette.muted,
        font: { size: 12, family: fontFamily },
      },
      tooltip: { enabled: interactive },
    },
  };
}

function axis(title: string, palette: ChartPalette, fontFamily: string) {
  return {
    title: { display: true, text: title, color: palette.ink, font: { size: 12, family: fontFamily } },
    ticks: { color: palette.muted, font: { size: 12, family: fontFamily } },
    grid: { color: palette.grid },
    border: { color: palette.muted },
  };
}

export function barChartConfig(chart: BarChartData, options: DrawingOptions = {}): ChartConfiguration<'bar'> {
  const palette = options.palette ?? lightChartPalette;
  const fontFamily = options.fontFamily ?? 'sans-serif';
  const interactive = options.interactive ?? true;
  const highest = Math.max(1, ...chart.bars.map((b) => b.value + (b.whiskerC ?? 0)));
  const base = common(chart, palette, fontFamily, interactive);
  const hasReference = chart.bars.some((b) => b.role === 'reference');
  const hasThrottled = chart.bars.some((b) => b.throttled);
  return {
    type: 'bar',
    data: {
      labels: chart.bars.map((b) => (b.role === 'reference' ? `${b.label} (reference)` : b.label)),
      datasets: [
        {
          label: chart.axisLabel,
          data: chart.bars.map((b) => b.value),
          backgroundColor: chart.bars.map((b) => colourOf(b, palette)),
          borderColor: chart.bars.map((b) => colourOf(b, palette)),
          borderWidth: 1,
          barPercentage: 0.8,
          categoryPercentage: 0.9,
        },
      ],
    },
    options: {
      ...base,
      indexAxis: 'y',
      scales: {
        // Bars start at zero; the space beyond the longest bar holds the printed value and its marks.
        x: { ...axis(chart.axisLabel, palette, fontFamily), min: 0, suggestedMax: Math.ceil(highest * 1.45) },
        y: { ...axis('', palette, fontFamily), title: { display: false, text: '' }, grid: { display: false } },
      },
      plugins: {
        ...base.plugins,
        legend: legend(palette, fontFamily, () => [
          legendItem(
            chart.kind === 'product' ? 'This product' : 'This roundup',
            palette.roundup,
            palette.roundup,
            palette.ink,
          ),
          ...(hasReference
            ? [legendItem('Reference, earlier roundups', palette.reference, palette.reference, palette.ink)]
            : []),
          ...(hasThrottled
            ? [legendItem('Throttled (hatched)', palette.throttled, palette.throttled, palette.ink)]
            : []),
          legendItem('Whisker: probe tolerance', palette.background, palette.ink, palette.ink),
        ]),
      },
    },
    plugins: [barMarksPlugin(chart, palette, fontFamily)],
  };
}

export function scatterChartConfig(
  chart: ScatterChartData,
  options: DrawingOptions = {},
): ChartConfiguration<'scatter'> {
  const palette = options.palette ?? lightChartPalette;
  const fontFamily = options.fontFamily ?? 'sans-serif';
  const interactive = options.interactive ?? true;
  const base = common(chart, palette, fontFamily, interactive);
  const major = 10 ** minorUnitDigits(chart.currency);
  const prices = chart.points.map((p) => p.priceMinor / major);
  const values = chart.points.map((p) => p.value);
  const spread = (list: number[], pad: number) =>
    list.length === 0 ? { min: 0, max: 1 } : { min: Math.min(...list) - pad, max: Math.max(...list) + pad };
  const priceRange = spread(prices, Math.max(10, (Math.max(...prices, 0) - Math.min(...prices, 0)) * 0.1));
  const valueRange = spread(values, 8);
  return {
    type: 'scatter',
    data: {
      datasets: [
        {
          label: chart.axisLabel,
          data: chart.points.map((p) => ({ x: p.priceMinor / major, y: p.value })),
          pointBackgroundColor: chart.points.map((p) => colourOf(p, palette)),
          pointBorderColor: chart.points.map((p) => colourOf(p, palette)),
          pointStyle: chart.points.map((p) => (p.throttled ? 'crossRot' : 'circle')),
          pointRadius: 6,
          pointBorderWidth: chart.points.map((p) => (p.throttled ? 3 : 1)),
        },
      ],
    },
    options: {
      ...base,
      scales: {
        x: {
          ...axis(chart.priceAxisLabel, palette, fontFamily),
          type: 'linear',
          min: Math.max(0, Math.floor(priceRange.min)),
          max: Math.ceil(priceRange.max * 1.25),
        },
        y: {
          ...axis(chart.axisLabel, palette, fontFamily),
          min: Math.max(0, Math.floor(valueRange.min)),
          max: Math.ceil(valueRange.max),
        },
      },
      plugins: {
        ...base.plugins,
        legend: legend(palette, fontFamily, () => [
          legendItem('This roundup', palette.roundup, palette.roundup, palette.ink),
          ...(chart.points.some((p) => p.throttled)
            ? [legendItem('Throttled (cross)', palette.throttled, palette.throttled, palette.ink)]
            : []),
        ]),
      },
    },
    plugins: [scatterMarksPlugin(chart, palette, fontFamily)],
  };
}

/** The chart.js configuration for any chart. */
export function chartJsConfig(chart: ChartData, options: DrawingOptions = {}): ChartConfiguration<'bar' | 'scatter'> {
  return (
    chart.kind === 'price-scatter' ? scatterChartConfig(chart, options) : barChartConfig(chart, options)
  ) as ChartConfiguration<'bar' | 'scatter'>;
}
