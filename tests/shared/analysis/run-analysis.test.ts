import { describe, expect, it } from 'vitest';
import { analyseLog } from '../../../shared/domain/analysis/analyse-log';
import { syntheticLoggerLog, type SyntheticLogSpec } from '../../../shared/generators/synthetic-logger-log';
import { analysisResultSchema, type AnalysisResult } from '../../../shared/schemas/analysis';
import { analyseSpec, twoProbeMapping, twoProbeRiseSpec } from '../../support/soak-logs';

const mapping = twoProbeMapping;

/** An hour at 1 Hz: two probes rising first-order to 75 and 70 °C (τ 7 min), a 21 °C room, a steady 4600 MHz clock. */
function hourLog(overrides: Partial<SyntheticLogSpec> = {}): SyntheticLogSpec {
  return {
    ...twoProbeRiseSpec({ durationS: 3600, seed: 11, noiseC: 0.2 }),
    power: { name: 'Package power [W]', watts: 200, noiseW: 1 },
    ...overrides,
  };
}

const analyse = analyseSpec;

const flagCodes = (analysis: AnalysisResult) => analysis.flags.map((flag) => flag.code);

describe('when a tester uploads a clean hour-long soak', () => {
  const analysis = analyse(hourLog());

  it('then the result is the document the API returns', () => {
    expect(analysisResultSchema.safeParse(analysis).success).toBe(true);
  });

  it('then the peak is the hottest probe at its plateau, with spike-free noise only', () => {
    // First principles: 30 + 45·(1 − e^(−3599/420)) = 74.99 °C; σ = 0.2 °C noise after a 5-sample median adds < 0.5 °C.
    expect(analysis.peakChannel).toBe('VRM 1 [°C]');
    expect(analysis.peakC).toBeGreaterThan(74.9);
    expect(analysis.peakC).toBeLessThan(75.5);
    expect(analysis.peakAtS).toBeGreaterThan(2400);
    expect(analysis.channels.map((channel) => channel.column)).toEqual(['VRM 1 [°C]', 'VRM 2 [°C]']);
    expect(analysis.channels[1].peakC).toBeLessThan(70.6);
  });

  it('then it reached steady state with the final-window mean at the plateau', () => {
    expect(analysis.reachedSteadyState).toBe(true);
    expect(analysis.steadyStateMeanC).toBeCloseTo(75, 1);
    expect(analysis.channels.every((channel) => channel.reachedSteadyState)).toBe(true);
    expect(analysis.steadyStateRule).toContain('IEC 62368-1 B.1.6');
  });

  it('then the first-order fit finds τ and the plateau, and the soak lasted well over 5 τ', () => {
    expect(Math.abs(analysis.prediction!.tauS - 420) / 420).toBeLessThan(0.03);
    expect(analysis.prediction!.predictedSteadyC).toBeCloseTo(75, 0);
    expect(analysis.prediction!.soakAtLeastFiveTau).toBe(true);
  });

  it('then ambient, delta over ambient and the normalised peak follow (first principles: 21 + (peak − 21))', () => {
    expect(analysis.ambientMeanC).toBeCloseTo(21, 1);
    expect(analysis.ambientDriftC!).toBeLessThan(0.1);
    expect(analysis.deltaOverAmbientC!).toBeCloseTo(analysis.peakC - analysis.ambientFinalWindowMeanC!, 10);
    expect(analysis.normalizedPeakC!).toBeCloseTo(21 + analysis.deltaOverAmbientC!, 10);
  });

  it('then soak, sample rate, throttle and flags are clean', () => {
    // The soak runs from the load start to the last sample: 0 to 3599 s is 3599 s (complete within one interval).
    expect(analysis).toMatchObject({
      soakS: 3599,
      requiredSoakS: 3600,
      sampleIntervalS: 1,
      sampleRateHz: 1,
      sampleCount: 3600,
    });
    expect(analysis.throttle).toMatchObject({ detected: false, source: 'clock', firstAtS: null, shareThrottled: 0 });
    expect(analysis.flags).toEqual([]);
  });

  it('then the verdict is Comfortable, with its rule, and the peak carries its IEC 60584-1 Class 2 band (±2.5 °C)', () => {
    expect(analysis.verdict.code).toBe('comfortable');
    expect(analysis.verdict.rule).toMatch(/^The peak, 7\d\.\d\u2009°C, is below 80\.0\u2009°C\.$/);
    expect(analysis.uncertainty).toEqual({
      toleranceClass: 'iec-60584-1-class-2',
      standard: 'IEC 60584-1:2013 Class 2',
      peakToleranceC: 2.5,
      note: null,
    });
  });
});

describe('analysis stories with known answers', () => {
  it('when a probe spikes for one sample, then the peak ignores it and the spike is flagged at its time', () => {
    const spec = hourLog({
      probes: [
        { name: 'VRM 1', startC: 30, riseC: 45, tauS: 420, spikes: [{ atS: 1500, deltaC: 40 }] },
        { name: 'VRM 2', startC: 30, riseC: 40, tauS: 400 },
      ],
    });
    const analysis = analyse(spec);
    // First principles: noise-free, so the peak is the last sample, 30 + 45·(1 − e^(−3599/420)) = 74.9916 °C.
    expect(analysis.peakC).toBeCloseTo(74.99, 2);
    // At 1500 s the probe reads 30 + 45·(1 − e^(−1500/420)) = 73.73 °C, the spike 40 °C more (first principles).
    expect(analysis.spikes).toEqual([
      { channel: 'VRM 1 [°C]', atS: 1500, rawC: expect.closeTo(113.73, 1), medianC: expect.closeTo(73.73, 1) },
    ]);
    expect(analysis.flags).toMatchObject([{ code: 'probe-spike', channel: 'VRM 1 [°C]', atS: 1500 }]);
  });

  it('when the clock drops to 2800 MHz at minute 30, then the run is Throttled from 30 min with half the soak throttled', () => {
    const analysis = analyse(
      hourLog({ clock: { name: 'CPU clock [MHz]', mhz: 4600, drop: { fromS: 1800, value: 2800 } } }),
    );
    expect(analysis.throttle).toMatchObject({ detected: true, source: 'clock', firstAtS: 1800, shareThrottled: 0.5 });
    expect(analysis.verdict).toMatchObject({ code: 'throttled', label: 'Throttled' });
    expect(analysis.verdict.rule).toContain('from 30\u2009min.');
  });

  it('when no clock is logged, then a package-power cut reveals the throttle', () => {
    const spec = hourLog({
      clock: null,
      power: { name: 'Package power [W]', watts: 200, drop: { fromS: 2400, value: 120 } },
    });
    const analysis = analyse(spec, {}, { ...mapping, clock: null });
    expect(analysis.throttle).toMatchObject({ detected: true, source: 'power', firstAtS: 2400 });
    expect(analysis.throttle.shareThrottled).toBeCloseTo(1 / 3, 10);
  });

  it('when no clock is logged and the tester says "throttled at minute 42", then the run fails and the entry is flagged as manual', () => {
    const analysis = analyse(hourLog({ clock: null }), { manualThrottleMinute: 42 }, { ...mapping, clock: null });
    expect(analysis.throttle).toMatchObject({ detected: true, source: 'manual', firstAtS: 2520, shareThrottled: null });
    expect(analysis.verdict.code).toBe('throttled');
    expect(analysis.flags).toMatchObject([{ code: 'manual-entry', atS: 2520 }]);
  });

  it('when a clock is logged, then a manual throttle minute is flagged and the clock decides', () => {
    const analysis = analyse(hourLog(), { manualThrottleMinute: 42 });
    expect(analysis.throttle.source).toBe('clock');
    expect(analysis.verdict.code).toBe('comfortable');
    expect(analysis.flags[0].message).toContain('the logged clock decides');
  });

  it('when a tester uploads a log whose ambient drifts 3 °C, then the run is flagged', () => {
    const analysis = analyse(hourLog({ ambient: { name: 'Ambient', startC: 20, driftC: 3 } }));
    expect(analysis.ambientDriftC!).toBeCloseTo(3, 2);
    expect(analysis.ambientMinC).toBeCloseTo(20, 2);
    expect(analysis.ambientMaxC).toBeCloseTo(23, 2);
    expect(analysis.flags).toMatchObject([
      { code: 'ambient-drift', message: 'Ambient drifted +3.0\u2009°C over the run (limit 2.0\u2009°C).' },
    ]);
  });

  it('when ambient drifts 1 °C, then it stays within the 2 °C limit', () => {
    expect(flagCodes(analyse(hourLog({ ambient: { name: 'Ambient', startC: 20.5, driftC: 1 } })))).toEqual([]);
  });

  it('when the room is at 25 °C, then ambient is out of range and the normalised peak is 4 °C lower (first principles)', () => {
    const analysis = analyse(hourLog({ ambient: { name: 'Ambient', startC: 25 } }));
    expect(flagCodes(analysis)).toEqual(['ambient-out-of-range']);
    expect(analysis.normalizedPeakC!).toBeCloseTo(analysis.peakC - 4, 10);
  });

  it('when the bench profile judges the normalised peak, then a warm room no longer makes a Warm verdict', () => {
    const spec = hourLog({
      ambient: { name: 'Ambient', startC: 27 },
      probes: [
        { name: 'VRM 1', startC: 35, riseC: 47, tauS: 400 },
        { name: 'VRM 2', startC: 30, riseC: 30, tauS: 400 },
      ],
    });
    expect(analyse(spec).verdict.code).toBe('warm');
    const normalized = analyse(spec, { useNormalizedPeak: true });
    // 82 − 27 = 55 °C over ambient; 21 + 55 = 76 °C.
    expect(normalized.normalizedPeakC).toBeCloseTo(76, 1);
    expect(normalized.verdict).toMatchObject({ code: 'comfortable', basis: 'normalized' });
  });

  it('when a probe settles at 104 °C without throttling, then the run is Hot but held', () => {
    const spec = hourLog({
      probes: [
        { name: 'VRM 1', startC: 40, riseC: 64, tauS: 400 },
        { name: 'VRM 2', startC: 40, riseC: 50, tauS: 400 },
      ],
    });
    expect(analyse(spec).verdict.code).toBe('hot-but-held');
  });

  it('when the soak is cut at 20 minutes with a slow rise, then it is flagged short, not steady, short of 5 τ, with a prediction', () => {
    const spec = hourLog({
      durationS: 1200,
      probes: [
        { name: 'VRM 1', startC: 30, riseC: 50, tauS: 600 },
        { name: 'VRM 2', startC: 30, riseC: 40, tauS: 600 },
      ],
    });
    const analysis = analyse(spec);
    expect(analysis.soakS).toBe(1199);
    expect(flagCodes(analysis)).toEqual(['soak-too-short', 'not-steady', 'not-steady', 'short-of-five-tau']);
    expect(analysis.reachedSteadyState).toBe(false);
    expect(analysis.prediction!.tauS).toBeCloseTo(600, 0);
    expect(analysis.prediction!.predictedSteadyC).toBeCloseTo(80, 1);
    expect(analysis.prediction!.soakAtLeastFiveTau).toBe(false);
  });

  it('when the logger misses rows and a probe drops out, then both are flagged with their times', () => {
    const spec = hourLog({
      missingRows: [{ fromS: 600, toS: 630 }],
      probes: [
        { name: 'VRM 1', startC: 30, riseC: 45, tauS: 420, dropouts: [{ fromS: 2000, toS: 2010, marker: 'OPEN' }] },
        { name: 'VRM 2', startC: 30, riseC: 40, tauS: 400 },
      ],
    });
    const analysis = analyse(spec);
    expect(analysis.gaps).toEqual([{ startS: 599, endS: 630, missingSamples: 30 }]);
    expect(analysis.dropouts).toEqual([{ channel: 'VRM 1 [°C]', startS: 2000, endS: 2009, samples: 10 }]);
    expect(analysis.channels[0].gapSamples).toBe(10);
    expect(flagCodes(analysis)).toEqual(['gaps', 'probe-dropout']);
    expect(analysis.flags[0].message).toBe(
      '30 missing sample(s) in 1 gap(s) of the time column, first at 9\u2009min 59\u2009s.',
    );
  });

  it('when the log starts idle, then the load start is read from package power and the soak counts from it', () => {
    const spec = hourLog({
      durationS: 3720,
      loadStartS: 120,
      power: { name: 'Package power [W]', watts: 200, idleWatts: 30 },
      probes: [
        { name: 'VRM 1', startC: 30, riseC: 45, tauS: 420 },
        { name: 'VRM 2', startC: 30, riseC: 40, tauS: 400 },
      ],
    });
    const analysis = analyse(spec);
    expect(analysis.loadStartS).toBe(120);
    expect(analysis.soakS).toBe(3599);
    expect(analysis.loggedS).toBe(3719);
    expect(analysis.prediction!.tauS).toBeCloseTo(420, 0);
    expect(analysis.prediction!.startC).toBeCloseTo(30, 1);
  });

  it('when the probes are Class 1 or special-limits wire, then the peak band follows that standard', () => {
    const spec = hourLog({
      probes: [
        { name: 'VRM 1', startC: 30, riseC: 45, tauS: 420 },
        { name: 'VRM 2', startC: 30, riseC: 40, tauS: 400 },
      ],
    });
    // IEC 60584-1 Class 1: max(1.5, 0.004 × 75) = 1.5 °C; ASTM E230 special limits: max(1.1, 0.004 × 75) = 1.1 °C.
    expect(analyse(spec, { toleranceClass: 'iec-60584-1-class-1' }).uncertainty.peakToleranceC).toBe(1.5);
    expect(analyse(spec, { toleranceClass: 'astm-e230-special' }).uncertainty).toMatchObject({
      peakToleranceC: 1.1,
      standard: 'ASTM E230 special limits',
    });
  });

  it('when no ambient probe is mapped, then delta and normalised peak are absent and flagged', () => {
    const analysis = analyse(hourLog(), {}, { ...mapping, ambient: null });
    expect(analysis).toMatchObject({ ambientMeanC: null, deltaOverAmbientC: null, normalizedPeakC: null });
    expect(flagCodes(analysis)).toEqual(['ambient-missing']);
  });

  it('when the tester lets Benchwire guess the mapping, then the guess is used but flagged for confirmation', () => {
    const outcome = analyseLog(syntheticLoggerLog(hourLog()), {});
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    expect(outcome.preview.guessedMapping).toEqual({ time: 'Time [s]', ...mapping });
    expect(outcome.analysis.flags[0]).toMatchObject({ code: 'mapping-guessed', severity: 'warning' });
  });

  it('when a 10 Hz log is logged in °F with a decimal comma and semicolons, then the figures match the °C log', () => {
    const celsius = analyse(hourLog({ sampleHz: 10, durationS: 900 }), { soakMinutes: 15 });
    const fahrenheit = analyse(
      hourLog({ sampleHz: 10, durationS: 900, unit: 'F', decimalComma: true, delimiter: ';', decimals: 3 }),
      { soakMinutes: 15 },
      {
        vrm: ['VRM 1 [°F]', 'VRM 2 [°F]'],
        ambient: 'Ambient [°F]',
        clock: 'CPU clock [MHz]',
        power: 'Package power [W]',
      },
    );
    expect(fahrenheit.sampleRateHz).toBeCloseTo(10, 6);
    expect(fahrenheit.peakC).toBeCloseTo(celsius.peakC, 1);
    expect(fahrenheit.channels[0].unit).toBe('F');
  });
});
