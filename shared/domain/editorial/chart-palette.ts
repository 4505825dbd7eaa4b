// Benchwire's chart palette, from the design notes (DESIGN.md, "Palette"): every colour a chart draws — bars,
// whiskers, labels, grid text — keeps at least 3:1 against the chart's background (WCAG 2.x, graphics and large
// text), and text at least 4.5:1. tests/shared/editorial/chart-palette.test.ts measures each pair.

export interface ChartPalette {
  background: string;
  /** Titles, values at the bar ends, tolerance whiskers. */
  ink: string;
  /** Axis ticks, footnotes. */
  muted: string;
  /** The roundup's own products. */
  roundup: string;
  /** Reference products from earlier roundups. */
  reference: string;
  /** Throttled runs: always with a hatch and a text label as well. */
  throttled: string;
  /** Grid lines: decoration only, not information, so they may be faint. */
  grid: string;
}

export const lightChartPalette: ChartPalette = {
  background: '#FAF8F3',
  ink: '#1B2433',
  muted: '#5B6472',
  roundup: '#A4521F',
  reference: '#6B7A8F',
  throttled: '#B42318',
  grid: '#E4E0D6',
};

export const darkChartPalette: ChartPalette = {
  background: '#10161F',
  ink: '#FAF8F3',
  muted: '#A9B1BD',
  roundup: '#E08A4F',
  reference: '#8E9BAD',
  throttled: '#F0705F',
  grid: '#2A3340',
};

/** The palette entries that carry information and must stand out from the background. */
export const informationColours = ['ink', 'muted', 'roundup', 'reference', 'throttled'] as const;
/** The entries used for text, which needs 4.5:1. */
export const textColours = ['ink', 'muted'] as const;
