import { describe, expect, it } from 'vitest';
import type { SyntheticLogSpec } from '../../../shared/generators/synthetic-logger-log';
import type { AnalysisOptionsInput, ColumnMapping } from '../../../shared/schemas/analysis';
import { analyseSpec, twoProbeRiseSpec } from '../../support/soak-logs';

const mapping: ColumnMapping = { vrm: ['VRM 1 [°C]', 'VRM 2 [°C]'], ambient: 'Ambient [°C]', clock: 'CPU clock [MHz]' };

/**
 * A rise whose plateau crosses the comfortable limit: VRM 1 follows T(t) = 30 + 52·(1 − e^(−t/420)) °C, settling at
 * 82 °C (Warm), VRM 2 settles at 70 °C; 1 Hz, a 21 °C room, a steady clock. Cut at `durationS`.
 */
function rise(durationS: number, overrides: Partial<SyntheticLogSpec> = {}): SyntheticLogSpec {
  return { ...twoProbeRiseSpec({ durationS, seed: 5, noiseC: 0.1, vrm1RiseC: 52 }), ...overrides };
}

/** A rise that reaches its plateau early (τ = 1 min): VRM 1 settles at 70 °C, VRM 2 at 60 °C. Cut at `durationS`. */
function earlyPlateau(durationS: number): SyntheticLogSpec {
  return rise(durationS, {
    probes: [
      { name: 'VRM 1', startC: 30, riseC: 40, tauS: 60 },
      { name: 'VRM 2', startC: 30, riseC: 30, tauS: 60 },
    ],
  });
}

function analyse(spec: SyntheticLogSpec, options: AnalysisOptionsInput = {}) {
  return analyseSpec(spec, options, mapping);
}

describe('no verdict from an unfinished soak', () => {
  it.each([
    // First-order step response 1 − e^(−t/τ) (Ogata, first-order systems): 5 min = 0.71 τ shows 51 % of the rise,
    // 10 min = 1.43 τ shows 76 %: too little to extrapolate by the 2 τ rule.
    [300, 0.51],
    [600, 0.76],
  ])('when the log is cut at %i s, still climbing, then the verdict is withheld and says why', (durationS, shown) => {
    const analysis = analyse(rise(durationS));
    // The measured peak is far below the plateau: 30 + 52·share.
    expect(analysis.peakC).toBeCloseTo(30 + 52 * shown, 0);
    expect(analysis.verdict).toMatchObject({
      status: 'withheld',
      code: null,
      label: 'No verdict yet',
      judgedC: null,
      basis: null,
    });
    expect(analysis.verdict.rule).toContain('No verdict from an unfinished soak');
    expect(analysis.verdict.rule).toContain('of the 60\u2009min required');
    expect(analysis.verdict.rule).toContain('a prediction needs at least 2 τ');
    expect(analysis.verdict.concerns.slice(0, 2)).toEqual([
      { code: 'soak-too-short', label: 'Soak shorter than required', effect: 'withholds' },
      { code: 'not-steady', label: 'Not settled', effect: 'withholds' },
    ]);
  });

  it('when a 10-minute log climbs about 20 °C over its last 10 minutes into the Warm band, then it is not called Warm', () => {
    // The case as a tester met it: 65 + 40·(1 − e^(−t/900)) reaches 84.5 °C at 600 s (first principles), Warm by its
    // measured peak; τ = 900 s means the log shows 0.67 τ of the rise.
    const analysis = analyse(
      rise(600, {
        probes: [
          { name: 'VRM 1', startC: 65, riseC: 40, tauS: 900 },
          { name: 'VRM 2', startC: 40, riseC: 10, tauS: 900 },
        ],
      }),
    );
    expect(analysis.peakC).toBeGreaterThan(80);
    expect(analysis.verdict.status).toBe('withheld');
    expect(analysis.verdict.code).toBeNull();
  });

  it('when the log is cut at 20 minutes (2.9 τ) with a good first-order fit, then the verdict is provisional on the predicted plateau', () => {
    const analysis = analyse(rise(1200));
    // First principles: at 1200 s VRM 1 reads 30 + 52·(1 − e^(−1200/420)) = 79.0 °C, below 80 °C, so its measured
    // peak would say Comfortable; the fitted plateau is 30 + 52 = 82 °C, which is Warm.
    expect(analysis.peakC).toBeLessThan(80);
    expect(analysis.prediction).toMatchObject({ goodFit: true });
    expect(analysis.prediction!.predictedSteadyC).toBeCloseTo(82, 0);
    expect(analysis.verdict).toMatchObject({
      status: 'provisional',
      code: 'warm',
      label: 'Provisional: Warm',
      judgedFrom: 'predicted-steady-state',
      basis: 'absolute',
    });
    expect(analysis.verdict.judgedC!).toBeCloseTo(82, 0);
    expect(analysis.verdict.rule).toMatch(
      /^Provisional, because the soak lasted 19\u2009min 59\u2009s of the 60\u2009min required/,
    );
    expect(analysis.verdict.concerns[0]).toEqual({
      code: 'soak-too-short',
      label: 'Soak shorter than required',
      effect: 'makes-provisional',
    });
    expect(analysis.channels.map((channel) => Math.round(channel.predictedSteadyC!))).toEqual([82, 70]);
  });

  it('when the log is cut at 40 minutes, settled but short, then the verdict is still provisional', () => {
    const analysis = analyse(rise(2400));
    expect(analysis.reachedSteadyState).toBe(true);
    expect(analysis.verdict).toMatchObject({ status: 'provisional', code: 'warm', label: 'Provisional: Warm' });
  });

  it('when the same rise is logged for the full hour, then the verdict is final and judged on the measured peak', () => {
    const analysis = analyse(rise(3600));
    expect(analysis.verdict).toMatchObject({
      status: 'final',
      code: 'warm',
      label: 'Warm',
      judgedFrom: 'measured-peak',
    });
    expect(analysis.verdict.concerns).toEqual([]);
  });

  it('when a rise reaches its plateau early (τ = 1 min) and the soak runs its full length, then it keeps its normal verdict', () => {
    const analysis = analyse(earlyPlateau(3600));
    expect(analysis.reachedSteadyState).toBe(true);
    expect(analysis.verdict).toMatchObject({ status: 'final', code: 'comfortable', label: 'Comfortable' });
    // The same early plateau on a 30-minute configuration with 30 minutes logged: complete, final.
    const configured = analyse(earlyPlateau(1800), { soakMinutes: 30 });
    expect(configured.verdict).toMatchObject({ status: 'final', code: 'comfortable' });
  });

  it('when an unfinished soak throttled, then it fails all the same: more soak cannot undo a throttle', () => {
    const analysis = analyse(
      rise(900, { clock: { name: 'CPU clock [MHz]', mhz: 4600, drop: { fromS: 600, value: 2800 } } }),
    );
    expect(analysis.verdict).toMatchObject({ status: 'final', code: 'throttled', label: 'Throttled' });
    expect(analysis.verdict.rule).toContain('It fails however long the soak had lasted.');
  });
});
