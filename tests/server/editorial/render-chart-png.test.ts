import { describe, expect, it } from 'vitest';
import { renderChartPng } from '../../../server/charts/render-chart-png';
import { configurationChart, priceScatterChart, type ChartSources } from '../../../shared/domain/editorial/chart-data';

const sources: ChartSources = {
  roomTargetC: 21,
  referenceRoomC: 21,
  configurations: [{ id: 1, name: 'Stock all-core', settingsMode: 'stock', soakMinutes: 60 }],
  tested: [
    { entryId: 1, productName: 'Alder B70' },
    { entryId: 2, productName: 'Birch B70' },
  ],
  references: [{ entryId: 3, productName: 'Elm X90', referenceRoundupTitle: 'Flagship boards' }],
  runs: [
    {
      entryId: 1,
      loadConfigurationId: 1,
      runId: 1,
      analysisId: 1,
      source: 'logger',
      peakC: 82.4,
      ambientC: 21.2,
      deltaOverAmbientC: 61.2,
      normalisedPeakC: 82.2,
      throttled: false,
      verdictCode: 'warm',
      verdictStatus: 'final',
      verdictLabel: 'Warm',
      toleranceClass: 'iec-60584-1-class-2',
    },
    {
      entryId: 2,
      loadConfigurationId: 1,
      runId: 2,
      analysisId: 2,
      source: 'manual',
      peakC: 71.0,
      ambientC: 21.0,
      deltaOverAmbientC: 50,
      normalisedPeakC: 71,
      throttled: true,
      verdictCode: 'throttled',
      verdictStatus: 'final',
      verdictLabel: 'Throttled',
      toleranceClass: 'iec-60584-1-class-2',
    },
  ],
  referenceRuns: [
    {
      entryId: 3,
      loadConfigurationId: 1,
      runId: 3,
      analysisId: 3,
      source: 'logger',
      peakC: 76.5,
      ambientC: 21,
      deltaOverAmbientC: 55.5,
      normalisedPeakC: 76.5,
      throttled: false,
      verdictCode: 'comfortable',
      verdictStatus: 'final',
      verdictLabel: 'Comfortable',
      toleranceClass: 'iec-60584-1-class-2',
    },
  ],
  prices: [
    { entryId: 1, amountMinor: 18999, currency: 'EUR', source: 'verdict' },
    { entryId: 2, amountMinor: 16499, currency: 'EUR', source: 'catalog' },
  ],
  currency: 'EUR',
};

/** Width and height from a PNG's IHDR chunk (PNG specification, ISO/IEC 15948: bytes 16–23, big-endian). */
function pngSize(png: Buffer) {
  expect(png.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  expect(png.subarray(12, 16).toString('ascii')).toBe('IHDR');
  return { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
}

describe('server-side chart images', () => {
  it('renders a configuration chart to a non-empty PNG of 1200 × 630', async () => {
    const png = await renderChartPng(
      configurationChart(sources, sources.configurations[0], {
        metric: 'peak',
        referenceEntryIds: null,
        loadConfigurationId: null,
      }),
    );
    expect(png.length).toBeGreaterThan(5_000);
    expect(pngSize(png)).toEqual({ width: 1200, height: 630 });
  });

  it('renders the price scatter at a requested size', async () => {
    const png = await renderChartPng(
      priceScatterChart(sources, { metric: 'delta', referenceEntryIds: null, loadConfigurationId: 1 }),
      { width: 800, height: 500 },
    );
    expect(png.length).toBeGreaterThan(5_000);
    expect(pngSize(png)).toEqual({ width: 800, height: 500 });
  });
});
