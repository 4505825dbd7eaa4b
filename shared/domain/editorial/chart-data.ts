import type { ToleranceClass, VerdictCode, VerdictStatus } from '../../schemas/analysis';
import type { LoadSettingsMode } from '../../schemas/load-configurations';
import { formatCelsius } from '../analysis/run-time-format';
import { thermocoupleToleranceC, thermocoupleToleranceClasses } from '../analysis/thermocouple-tolerance';
import { formatMoney } from '../planning/money';

// What a comparison chart shows, computed once from the runs of record: the ordering, the reference products, the
// labels and marks, the tolerance whiskers, the title and footnote. The app draws it with chart.js, the server
// renders the same data to PNG, and an approval freezes exactly this object.

export const chartMetrics = ['peak', 'delta', 'normalised'] as const;
export type ChartMetric = (typeof chartMetrics)[number];

export const chartMetricNames: Record<ChartMetric, string> = {
  peak: 'Peak temperature',
  delta: 'Rise over ambient',
  normalised: 'Normalised peak',
};

export type ChartKind = 'configuration' | 'product' | 'price-scatter';

/** The run of record of one product under one load configuration, with the figures of its current analysis. */
export interface RunOfRecordFacts {
  entryId: number;
  loadConfigurationId: number;
  runId: number;
  analysisId: number;
  source: 'logger' | 'manual';
  peakC: number | null;
  ambientC: number | null;
  deltaOverAmbientC: number | null;
  normalisedPeakC: number | null;
  throttled: boolean;
  verdictCode: VerdictCode | null;
  verdictStatus: VerdictStatus | null;
  verdictLabel: string | null;
  toleranceClass: ToleranceClass;
}

export interface ChartConfigurationFacts {
  id: number;
  name: string;
  settingsMode: LoadSettingsMode;
  soakMinutes: number;
}

export interface ChartEntryFacts {
  entryId: number;
  productName: string;
}

export interface ReferenceEntryFacts extends ChartEntryFacts {
  referenceRoundupTitle: string;
}

export interface PriceFacts {
  entryId: number;
  amountMinor: number;
  currency: string;
  /** Set by the editor as the price at publication, or the newest catalog price in the roundup's region. */
  source: 'verdict' | 'catalog';
}

/** Everything the charts of one roundup are computed from. */
export interface ChartSources {
  /** The room the bench profile targets; null without a profile. */
  roomTargetC: number | null;
  /** The room normalised peaks are referred to. */
  referenceRoomC: number;
  configurations: ChartConfigurationFacts[];
  tested: ChartEntryFacts[];
  references: ReferenceEntryFacts[];
  /** Runs of record of this roundup's tested products. */
  runs: RunOfRecordFacts[];
  /** Runs of record of the reference products in their earlier roundups (entryId: the reference entry). */
  referenceRuns: RunOfRecordFacts[];
  prices: PriceFacts[];
  /** The roundup's price-band currency; prices in another currency are left off the scatter, never converted. */
  currency: string;
}

/** The editor's choices for one chart. */
export interface ChartSettings {
  metric: ChartMetric;
  /** Reference entries to show (configuration charts); null: every reference with a run under the configuration. */
  referenceEntryIds: number[] | null;
  /** The load configuration a price scatter plots; null: the roundup's first. */
  loadConfigurationId: number | null;
}

export const defaultChartSettings: ChartSettings = {
  metric: 'peak',
  referenceEntryIds: null,
  loadConfigurationId: null,
};

/** What each bar or point carries besides its value, in words, so nothing is said by colour alone. */
export const chartMarkNames = { throttled: 'Throttled', manual: 'Manual entry', provisional: 'Provisional' } as const;

export interface ChartValue {
  key: string;
  label: string;
  role: 'roundup' | 'reference';
  value: number;
  valueText: string;
  /** ± thermocouple tolerance in °C; null when the reading is outside the class's range. */
  whiskerC: number | null;
  throttled: boolean;
  manual: boolean;
  provisional: boolean;
  /** The marks in words ("Throttled", "Manual entry", "Provisional"), printed beside the value. */
  marks: string[];
  verdictLabel: string | null;
  referenceRoundupTitle: string | null;
  runId: number;
  analysisId: number;
}

export interface ChartOmission {
  label: string;
  reason: string;
}

export interface BarChartData {
  kind: 'configuration' | 'product';
  key: string;
  title: string;
  axisLabel: string;
  footnote: string;
  metric: ChartMetric;
  bars: ChartValue[];
  omitted: ChartOmission[];
}

export interface ScatterPoint extends ChartValue {
  priceMinor: number;
  priceText: string;
  priceSource: PriceFacts['source'];
}

export interface ScatterChartData {
  kind: 'price-scatter';
  key: string;
  title: string;
  axisLabel: string;
  priceAxisLabel: string;
  currency: string;
  footnote: string;
  metric: ChartMetric;
  points: ScatterPoint[];
  omitted: ChartOmission[];
}

export type ChartData = BarChartData | ScatterChartData;

export const chartKeyFor = {
  configuration: (loadConfigurationId: number) => `configuration-${loadConfigurationId}`,
  product: (entryId: number) => `product-${entryId}`,
  priceScatter: () => 'price-scatter',
};

export function parseChartKey(
  key: string,
): { kind: 'configuration'; id: number } | { kind: 'product'; id: number } | { kind: 'price-scatter' } | null {
  if (key === 'price-scatter') return { kind: 'price-scatter' };
  const match = /^(configuration|product)-([1-9]\d{0,9})$/.exec(key);
  if (!match) return null;
  return { kind: match[1] as 'configuration' | 'product', id: Number(match[2]) };
}

function metricValue(run: RunOfRecordFacts, metric: ChartMetric): number | null {
  if (metric === 'peak') return run.peakC;
  if (metric === 'delta') return run.deltaOverAmbientC;
  return run.normalisedPeakC;
}

function toleranceOrNull(celsius: number, toleranceClass: ToleranceClass): number | null {
  try {
    return thermocoupleToleranceC(celsius, toleranceClass);
  } catch {
    return null;
  }
}

/**
 * The whisker of a value: the class tolerance of the peak reading (IEC 60584-1 / ASTM E230, REFERENCES.md). A rise
 * over ambient and a normalised peak are differences of two readings, the VRM probe and the ambient probe, so their
 * whisker is the sum of both tolerances: the worst case, both probes at their limit in opposite directions.
 */
export function whiskerFor(run: RunOfRecordFacts, metric: ChartMetric): number | null {
  if (run.peakC === null) return null;
  const peak = toleranceOrNull(run.peakC, run.toleranceClass);
  if (metric === 'peak' || peak === null) return peak;
  if (run.ambientC === null) return null;
  const ambient = toleranceOrNull(run.ambientC, run.toleranceClass);
  return ambient === null ? null : peak + ambient;
}

/**
 * Why a run gives no figure for the chart, or null when it does. A withheld verdict never becomes a bar: the QA
 * checks said the figure cannot be judged, so the chart does not show it as if it could.
 */
function omissionReason(run: RunOfRecordFacts | undefined, metric: ChartMetric): string | null {
  if (!run) return 'No run of record.';
  if (run.verdictStatus === 'withheld') return 'No verdict yet: the QA checks withhold this run’s figure.';
  if (metricValue(run, metric) === null) {
    return metric === 'peak' ? 'The run has no peak.' : 'No ambient was logged, so there is no figure over ambient.';
  }
  return null;
}

/** The run of record of one product under one load configuration, if there is one. */
function runOf(sources: ChartSources, entryId: number, configurationId: number) {
  return sources.runs.find((r) => r.entryId === entryId && r.loadConfigurationId === configurationId);
}

/**
 * The bars of a chart as it is built: `add` puts a run's bar in, or notes under `omittedLabel` why the run has
 * none; `shownRuns` are the runs behind the bars, for the footnote.
 */
function barCollector(metric: ChartMetric) {
  const bars: ChartValue[] = [];
  const omitted: ChartOmission[] = [];
  const shownRuns: RunOfRecordFacts[] = [];
  const add = (
    run: RunOfRecordFacts | undefined,
    key: string,
    label: string,
    role: ChartValue['role'],
    referenceRoundupTitle: string | null,
    omittedLabel = label,
  ) => {
    const reason = omissionReason(run, metric);
    if (reason || !run) omitted.push({ label: omittedLabel, reason: reason ?? 'No run of record.' });
    else {
      bars.push(chartValue(key, label, role, run, metric, referenceRoundupTitle));
      shownRuns.push(run);
    }
  };
  return { bars, omitted, shownRuns, add };
}

function chartValue(
  key: string,
  label: string,
  role: ChartValue['role'],
  run: RunOfRecordFacts,
  metric: ChartMetric,
  referenceRoundupTitle: string | null,
): ChartValue {
  const value = Math.round((metricValue(run, metric) as number) * 100) / 100;
  const throttled = run.throttled || run.verdictCode === 'throttled';
  const manual = run.source === 'manual';
  const provisional = run.verdictStatus === 'provisional';
  const marks: string[] = [];
  if (throttled) marks.push(chartMarkNames.throttled);
  if (manual) marks.push(chartMarkNames.manual);
  if (provisional) marks.push(chartMarkNames.provisional);
  return {
    key,
    label,
    role,
    value,
    valueText: formatCelsius(value),
    whiskerC: whiskerFor(run, metric),
    throttled,
    manual,
    provisional,
    marks,
    verdictLabel: run.verdictLabel,
    referenceRoundupTitle,
    runId: run.runId,
    analysisId: run.analysisId,
  };
}

/**
 * Best to worst: cooler first. A throttled run goes after every run that held, however cool its peak, because the
 * throttle cut the power that heats the VRM. Ties keep the product name order, so the ordering is stable.
 */
export function compareChartValues(a: ChartValue, b: ChartValue): number {
  if (a.throttled !== b.throttled) return a.throttled ? 1 : -1;
  return a.value - b.value || a.label.localeCompare(b.label);
}

function titleFor(metric: ChartMetric, referenceRoomC: number, subject: string): { title: string; axis: string } {
  if (metric === 'peak') return { title: `${subject}: peak VRM temperature, absolute`, axis: 'Peak, °C (absolute)' };
  if (metric === 'delta')
    return { title: `${subject}: VRM temperature rise over ambient`, axis: 'Rise over ambient, °C' };
  return {
    title: `${subject}: peak VRM temperature normalised to a ${formatCelsius(referenceRoomC)} room`,
    axis: `Peak normalised to ${formatCelsius(referenceRoomC)}, °C (over ambient)`,
  };
}

function footnoteFor(sources: ChartSources, soakMinutes: number[], runs: RunOfRecordFacts[]): string {
  const room = sources.roomTargetC === null ? 'Room not set' : `Room ${formatCelsius(sources.roomTargetC)}`;
  const soaks = [...new Set(soakMinutes)].sort((a, b) => a - b);
  const soak = soaks.length === 0 ? '' : `; ${soaks.join(' and ')}\u2009min soak per load`;
  const classes = [...new Set(runs.map((r) => thermocoupleToleranceClasses[r.toleranceClass].standard))];
  const whiskers = classes.length ? `Whiskers: thermocouple tolerance, ${classes.join(' / ')}.` : '';
  return `${room}${soak}. ${whiskers} Hatched bars throttled.`.replace(/ {2,}/g, ' ').trim();
}

/**
 * The references a configuration chart shows: only reference products measured under the same load configuration
 * (a figure from another load is not comparable), and of those the ones the editor selected (all when the editor
 * has not chosen). A selected reference without a run under this configuration is listed as omitted, with why.
 */
export function selectReferences(
  sources: ChartSources,
  loadConfigurationId: number,
  selected: number[] | null,
): { chosen: { entry: ReferenceEntryFacts; run: RunOfRecordFacts }[]; omitted: ChartOmission[] } {
  const chosen: { entry: ReferenceEntryFacts; run: RunOfRecordFacts }[] = [];
  const omitted: ChartOmission[] = [];
  for (const entry of sources.references) {
    if (selected !== null && !selected.includes(entry.entryId)) continue;
    const run = sources.referenceRuns.find(
      (r) => r.entryId === entry.entryId && r.loadConfigurationId === loadConfigurationId,
    );
    if (run) chosen.push({ entry, run });
    else if (selected !== null) {
      omitted.push({
        label: entry.productName,
        reason: `Not measured under this load configuration in “${entry.referenceRoundupTitle}”.`,
      });
    }
  }
  return { chosen, omitted };
}

/** The bar chart of one load configuration: this roundup's products and the chosen references, sorted. */
export function configurationChart(
  sources: ChartSources,
  configuration: ChartConfigurationFacts,
  settings: ChartSettings,
): BarChartData {
  const metric = settings.metric;
  const { bars, omitted, shownRuns, add } = barCollector(metric);
  for (const entry of sources.tested) {
    add(runOf(sources, entry.entryId, configuration.id), `entry-${entry.entryId}`, entry.productName, 'roundup', null);
  }
  const references = selectReferences(sources, configuration.id, settings.referenceEntryIds);
  omitted.push(...references.omitted);
  for (const { entry, run } of references.chosen) {
    const key = `entry-${entry.entryId}`;
    const omittedLabel = `${entry.productName} (reference)`;
    add(run, key, entry.productName, 'reference', entry.referenceRoundupTitle, omittedLabel);
  }
  bars.sort(compareChartValues);
  const chart = { kind: 'configuration', id: configuration.id, subject: configuration.name } as const;
  return barChart(sources, metric, { bars, omitted, shownRuns }, chart, [configuration.soakMinutes]);
}

/** One product across the roundup's load configurations, in the plan's order (lightest load first as planned). */
export function productChart(sources: ChartSources, entry: ChartEntryFacts, settings: ChartSettings): BarChartData {
  const metric = settings.metric;
  const { bars, omitted, shownRuns, add } = barCollector(metric);
  for (const configuration of sources.configurations) {
    const run = runOf(sources, entry.entryId, configuration.id);
    add(run, `configuration-${configuration.id}`, configuration.name, 'roundup', null);
  }
  const soakMinutes = sources.configurations.map((c) => c.soakMinutes);
  const chart = { kind: 'product', id: entry.entryId, subject: entry.productName } as const;
  return barChart(sources, metric, { bars, omitted, shownRuns }, chart, soakMinutes);
}

/** A bar chart from what its collector kept: the title names the subject, the footnote the soaks and the runs shown. */
function barChart(
  sources: ChartSources,
  metric: ChartMetric,
  { bars, omitted, shownRuns }: Omit<ReturnType<typeof barCollector>, 'add'>,
  chart: { kind: BarChartData['kind']; id: number; subject: string },
  soakMinutes: number[],
): BarChartData {
  const { title, axis } = titleFor(metric, sources.referenceRoomC, chart.subject);
  return {
    kind: chart.kind,
    key: chartKeyFor[chart.kind](chart.id),
    title,
    axisLabel: axis,
    footnote: footnoteFor(sources, soakMinutes, shownRuns),
    metric,
    bars,
    omitted,
  };
}

/** Price against temperature for the band's products under one load configuration. */
export function priceScatterChart(sources: ChartSources, settings: ChartSettings): ScatterChartData {
  const metric = settings.metric;
  const configuration =
    sources.configurations.find((c) => c.id === settings.loadConfigurationId) ?? sources.configurations[0];
  const points: ScatterPoint[] = [];
  const omitted: ChartOmission[] = [];
  const shownRuns: RunOfRecordFacts[] = [];
  for (const entry of sources.tested) {
    const run = configuration
      ? sources.runs.find((r) => r.entryId === entry.entryId && r.loadConfigurationId === configuration.id)
      : undefined;
    const price = sources.prices.find((p) => p.entryId === entry.entryId);
    const reason = omissionReason(run, metric);
    if (reason || !run) {
      omitted.push({ label: entry.productName, reason: reason ?? 'No run of record.' });
    } else if (!price) {
      omitted.push({ label: entry.productName, reason: 'No price at publication and no catalog price in the region.' });
    } else if (price.currency !== sources.currency) {
      omitted.push({
        label: entry.productName,
        reason: `Priced in ${price.currency}, not the band’s ${sources.currency}: prices are never converted.`,
      });
    } else {
      points.push({
        ...chartValue(`entry-${entry.entryId}`, entry.productName, 'roundup', run, metric, null),
        priceMinor: price.amountMinor,
        priceText: formatMoney(price.amountMinor, price.currency),
        priceSource: price.source,
      });
      shownRuns.push(run);
    }
  }
  points.sort((a, b) => a.priceMinor - b.priceMinor || a.label.localeCompare(b.label));
  const { title, axis } = titleFor(metric, sources.referenceRoomC, configuration?.name ?? 'No load configuration');
  return {
    kind: 'price-scatter',
    key: chartKeyFor.priceScatter(),
    title: `Price against temperature — ${title}`,
    axisLabel: axis,
    priceAxisLabel: `Price, ${sources.currency}`,
    currency: sources.currency,
    footnote: footnoteFor(sources, configuration ? [configuration.soakMinutes] : [], shownRuns),
    metric,
    points,
    omitted,
  };
}

/** Every chart of a roundup, in the order the charts screen lists them: per configuration, per product, the scatter. */
export function chartKeysOf(sources: ChartSources): string[] {
  return [
    ...sources.configurations.map((c) => chartKeyFor.configuration(c.id)),
    ...sources.tested.map((e) => chartKeyFor.product(e.entryId)),
    chartKeyFor.priceScatter(),
  ];
}

/** The chart's data for its key and settings, or null when the key names nothing in this roundup. */
export function chartFor(sources: ChartSources, key: string, settings: ChartSettings): ChartData | null {
  const parsed = parseChartKey(key);
  if (!parsed) return null;
  if (parsed.kind === 'price-scatter') return priceScatterChart(sources, settings);
  if (parsed.kind === 'configuration') {
    const configuration = sources.configurations.find((c) => c.id === parsed.id);
    return configuration ? configurationChart(sources, configuration, settings) : null;
  }
  const entry = sources.tested.find((e) => e.entryId === parsed.id);
  return entry ? productChart(sources, entry, settings) : null;
}

function valuesOf(chart: ChartData): ChartValue[] {
  return chart.kind === 'price-scatter' ? chart.points : chart.bars;
}

/**
 * What differs between the approved chart and the chart as it would be drawn now, in words for the editor; an
 * empty list means the approval still holds.
 */
export function describeChartChanges(approved: ChartData, current: ChartData): string[] {
  const changes: string[] = [];
  if (approved.title !== current.title) changes.push(`The title changed to “${current.title}”.`);
  if (approved.metric !== current.metric) changes.push(`The metric changed to ${chartMetricNames[current.metric]}.`);
  const before = new Map(valuesOf(approved).map((v) => [v.key, v]));
  const after = new Map(valuesOf(current).map((v) => [v.key, v]));
  for (const [key, now] of after) {
    const then = before.get(key);
    const who = now.role === 'reference' ? `${now.label} (reference)` : now.label;
    if (!then) {
      changes.push(`${who} was added.`);
      continue;
    }
    if (then.runId !== now.runId) changes.push(`${who}: another run of record (run ${then.runId} → ${now.runId}).`);
    else if (then.analysisId !== now.analysisId) changes.push(`${who}: the run was analysed again.`);
    if (then.value !== now.value) changes.push(`${who}: ${then.valueText} → ${now.valueText}.`);
    if (then.whiskerC !== now.whiskerC) changes.push(`${who}: the tolerance whisker changed.`);
    if (then.throttled !== now.throttled)
      changes.push(`${who}: ${now.throttled ? 'now throttled' : 'no longer throttled'}.`);
    if (then.provisional !== now.provisional || then.verdictLabel !== now.verdictLabel) {
      changes.push(
        `${who}: the verdict is now “${now.verdictLabel ?? 'none'}” (was “${then.verdictLabel ?? 'none'}”).`,
      );
    }
    if (then.manual !== now.manual)
      changes.push(`${who}: ${now.manual ? 'now a manual entry' : 'now from a logger file'}.`);
    const [thenPrice, nowPrice] = [then as Partial<ScatterPoint>, now as Partial<ScatterPoint>];
    if (thenPrice.priceMinor !== nowPrice.priceMinor) {
      changes.push(`${who}: the price changed from ${thenPrice.priceText} to ${nowPrice.priceText}.`);
    }
  }
  for (const [key, then] of before) {
    if (after.has(key)) continue;
    const who = then.role === 'reference' ? `${then.label} (reference)` : then.label;
    const why = current.omitted.find((o) => o.label === then.label || o.label === who);
    changes.push(why ? `${who} is left out: ${why.reason}` : `${who} was removed.`);
  }
  const omittedBefore = new Set(approved.omitted.map((o) => `${o.label}|${o.reason}`));
  const shownBefore = new Set(valuesOf(approved).flatMap((v) => [v.label, `${v.label} (reference)`]));
  for (const omission of current.omitted) {
    if (omittedBefore.has(`${omission.label}|${omission.reason}`) || shownBefore.has(omission.label)) continue;
    changes.push(`${omission.label} is left out: ${omission.reason}`);
  }
  if (changes.length === 0 && JSON.stringify(approved) !== JSON.stringify(current)) {
    if (approved.footnote !== current.footnote) changes.push(`The footnote changed to “${current.footnote}”.`);
    else changes.push('The chart’s labels changed.');
  }
  return changes;
}
