import { describe, expect, it } from 'vitest';
import {
  chartFor,
  chartKeysOf,
  configurationChart,
  describeChartChanges,
  defaultChartSettings,
  priceScatterChart,
  productChart,
  selectReferences,
  type ChartSources,
  type RunOfRecordFacts,
} from '../../../shared/domain/editorial/chart-data';

let nextId = 1;
function run(
  entryId: number,
  loadConfigurationId: number,
  peakC: number,
  over: Partial<RunOfRecordFacts> = {},
): RunOfRecordFacts {
  const id = nextId++;
  return {
    entryId,
    loadConfigurationId,
    runId: id,
    analysisId: 100 + id,
    source: 'logger',
    peakC,
    ambientC: 21,
    deltaOverAmbientC: peakC - 21,
    normalisedPeakC: peakC,
    throttled: false,
    verdictCode: peakC < 80 ? 'comfortable' : 'warm',
    verdictStatus: 'final',
    verdictLabel: peakC < 80 ? 'Comfortable' : 'Warm',
    toleranceClass: 'iec-60584-1-class-2',
    ...over,
  };
}

const fixture: ChartSources = buildFixture();

/** A fresh copy of one fixture, so run ids stay the same between calls. */
function sources(): ChartSources {
  return structuredClone(fixture);
}

function buildFixture(): ChartSources {
  return {
    roomTargetC: 21,
    referenceRoomC: 21,
    configurations: [
      { id: 1, name: 'Stock all-core', settingsMode: 'stock', soakMinutes: 60 },
      { id: 2, name: 'Fixed 5.2 GHz', settingsMode: 'fixed', soakMinutes: 60 },
    ],
    tested: [
      { entryId: 10, productName: 'Alder B70' },
      { entryId: 11, productName: 'Birch B70' },
      { entryId: 12, productName: 'Cedar B70' },
      { entryId: 13, productName: 'Dune B70' },
    ],
    references: [
      { entryId: 20, productName: 'Elm X90', referenceRoundupTitle: 'Flagship boards' },
      { entryId: 21, productName: 'Fir X90', referenceRoundupTitle: 'Flagship boards' },
    ],
    runs: [
      run(10, 1, 84.2),
      run(11, 1, 71.5, { source: 'manual' }),
      // Throttled at a cooler peak: the throttle cut the power.
      run(12, 1, 66.0, { throttled: true, verdictCode: 'throttled', verdictLabel: 'Throttled' }),
      run(13, 1, 90.1, { verdictStatus: 'withheld', verdictCode: null, verdictLabel: 'No verdict yet' }),
      run(10, 2, 97.0, { verdictStatus: 'provisional', verdictLabel: 'Provisional: Warm' }),
    ],
    referenceRuns: [run(20, 1, 78.0), run(21, 2, 88.0)],
    prices: [
      { entryId: 10, amountMinor: 18999, currency: 'EUR', source: 'verdict' },
      { entryId: 11, amountMinor: 15999, currency: 'EUR', source: 'catalog' },
      { entryId: 12, amountMinor: 21000, currency: 'GBP', source: 'catalog' },
    ],
    currency: 'EUR',
  };
}

describe('configuration bar chart', () => {
  it('sorts best to worst, with throttled runs after every run that held', () => {
    const chart = configurationChart(sources(), sources().configurations[0], defaultChartSettings);
    // Worked by hand from the fixture: held runs 71.5 (Birch), 78.0 (Elm, reference), 84.2 (Alder); then Cedar throttled.
    expect(chart.bars.map((b) => b.label)).toEqual(['Birch B70', 'Elm X90', 'Alder B70', 'Cedar B70']);
    expect(chart.bars.map((b) => b.role)).toEqual(['roundup', 'reference', 'roundup', 'roundup']);
  });

  it('marks throttled, manual and provisional figures in words, and never draws a withheld verdict', () => {
    const chart = configurationChart(sources(), sources().configurations[0], defaultChartSettings);
    const byLabel = new Map(chart.bars.map((b) => [b.label, b]));
    expect(byLabel.get('Cedar B70')?.marks).toEqual(['Throttled']);
    expect(byLabel.get('Birch B70')?.marks).toEqual(['Manual entry']);
    expect(byLabel.has('Dune B70')).toBe(false);
    expect(chart.omitted).toEqual([{ label: 'Dune B70', reason: expect.stringMatching(/No verdict yet/) }]);
    const overclocked = configurationChart(sources(), sources().configurations[1], defaultChartSettings);
    expect(overclocked.bars.find((b) => b.label === 'Alder B70')?.marks).toEqual(['Provisional']);
  });

  it('puts the thermocouple tolerance on each bar as a whisker', () => {
    const chart = configurationChart(sources(), sources().configurations[0], defaultChartSettings);
    // IEC 60584-1:2013 Class 2 (REFERENCES.md): ±2.5 °C or ±0.0075·|t|, the larger; at 84.2 °C 0.0075·84.2 = 0.63, so 2.5.
    expect(chart.bars.find((b) => b.label === 'Alder B70')?.whiskerC).toBe(2.5);
    // Over ambient, two readings: 2.5 (VRM at 84.2 °C) + 2.5 (ambient at 21 °C) = 5.0 in the worst case.
    const delta = configurationChart(sources(), sources().configurations[0], {
      ...defaultChartSettings,
      metric: 'delta',
    });
    const alder = delta.bars.find((b) => b.label === 'Alder B70');
    expect(alder?.value).toBeCloseTo(63.2, 6);
    expect(alder?.whiskerC).toBe(5);
    // ASTM E230 special limits: ±1.1 °C or ±0.4 %, the larger; at 300 °C 0.004·300 = 1.2 °C.
    const hot = configurationChart(
      { ...sources(), runs: [run(10, 1, 300, { toleranceClass: 'astm-e230-special' })], references: [] },
      sources().configurations[0],
      defaultChartSettings,
    );
    expect(hot.bars[0].whiskerC).toBeCloseTo(1.2, 10);
  });

  it('titles the chart with its configuration, metric and basis, and footnotes the room and soak', () => {
    const chart = configurationChart(sources(), sources().configurations[0], {
      ...defaultChartSettings,
      metric: 'delta',
    });
    expect(chart.title).toBe('Stock all-core: VRM temperature rise over ambient');
    expect(chart.footnote).toMatch(
      /^Room 21\.0\u2009°C; 60\u2009min soak per load\. Whiskers: thermocouple tolerance, IEC 60584-1:2013 Class 2\./,
    );
  });
});

describe('reference selection', () => {
  it('shows only references measured under the same load configuration', () => {
    const all = selectReferences(sources(), 1, null);
    expect(all.chosen.map((c) => c.entry.productName)).toEqual(['Elm X90']);
    expect(all.omitted).toEqual([]);
    const second = selectReferences(sources(), 2, null);
    expect(second.chosen.map((c) => c.entry.productName)).toEqual(['Fir X90']);
  });

  it('keeps only the references the editor chose, and says why a chosen one is missing', () => {
    expect(selectReferences(sources(), 1, []).chosen).toEqual([]);
    const picked = selectReferences(sources(), 1, [21]);
    expect(picked.chosen).toEqual([]);
    expect(picked.omitted[0].reason).toMatch(/Not measured under this load configuration in “Flagship boards”/);
  });
});

describe('product and price charts', () => {
  it('a product chart lists its configurations in the plan’s order', () => {
    const chart = productChart(sources(), sources().tested[0], defaultChartSettings);
    expect(chart.bars.map((b) => [b.label, b.value])).toEqual([
      ['Stock all-core', 84.2],
      ['Fixed 5.2 GHz', 97],
    ]);
  });

  it('the price scatter plots the band’s products in its currency, never converting', () => {
    const chart = priceScatterChart(sources(), defaultChartSettings);
    expect(chart.points.map((p) => [p.label, p.priceMinor, p.value])).toEqual([
      ['Birch B70', 15999, 71.5],
      ['Alder B70', 18999, 84.2],
    ]);
    expect(chart.omitted.map((o) => o.label)).toEqual(['Cedar B70', 'Dune B70']);
    expect(chart.omitted[0].reason).toMatch(/never converted/);
  });

  it('every chart of a roundup has a key that finds it again', () => {
    const keys = chartKeysOf(sources());
    expect(keys).toEqual([
      'configuration-1',
      'configuration-2',
      'product-10',
      'product-11',
      'product-12',
      'product-13',
      'price-scatter',
    ]);
    for (const key of keys) expect(chartFor(sources(), key, defaultChartSettings)?.key).toBe(key);
    expect(chartFor(sources(), 'configuration-99', defaultChartSettings)).toBeNull();
    expect(chartFor(sources(), 'configuration-01', defaultChartSettings)).toBeNull();
  });
});

describe('what changed since approval', () => {
  it('names a new run of record and its value', () => {
    const before = configurationChart(sources(), sources().configurations[0], defaultChartSettings);
    const changed = sources();
    changed.runs[0] = run(10, 1, 86.0);
    const after = configurationChart(changed, changed.configurations[0], defaultChartSettings);
    const changes = describeChartChanges(before, after);
    expect(changes.join(' ')).toMatch(/Alder B70: another run of record/);
    expect(changes.join(' ')).toMatch(/84\.2\u2009°C → 86\.0\u2009°C/);
    expect(describeChartChanges(before, before)).toEqual([]);
  });

  it('names a reference taken off the chart and a price change', () => {
    const before = configurationChart(sources(), sources().configurations[0], defaultChartSettings);
    const after = configurationChart(sources(), sources().configurations[0], {
      ...defaultChartSettings,
      referenceEntryIds: [],
    });
    expect(describeChartChanges(before, after)).toEqual(['Elm X90 (reference) was removed.']);
    const priced = sources();
    priced.prices[0] = { ...priced.prices[0], amountMinor: 17999 };
    const changes = describeChartChanges(
      priceScatterChart(sources(), defaultChartSettings),
      priceScatterChart(priced, defaultChartSettings),
    );
    expect(changes.join(' ')).toMatch(/Alder B70: the price changed/);
  });
});
