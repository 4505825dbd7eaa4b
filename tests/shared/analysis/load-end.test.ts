import { describe, expect, it } from 'vitest';
import { detectLoadEndIndex } from '../../../shared/domain/analysis/load-end';
import type { SyntheticLogSpec } from '../../../shared/generators/synthetic-logger-log';
import { analysisOptionsSchema } from '../../../shared/schemas/analysis';
import { analyseSpec, twoProbeMapping, twoProbeRiseSpec } from '../../support/soak-logs';

const mapping = twoProbeMapping;

/**
 * An hour under load (200 W, 4600 MHz) followed by a 15-minute cool-down: power falls to 30 W and the clock to
 * 1200 MHz at 3600 s, and the probes cool first-order toward their start. Common practice (no source): loggers run on
 * after the load stops.
 */
function soakWithTail(overrides: Partial<SyntheticLogSpec> = {}): SyntheticLogSpec {
  return {
    ...twoProbeRiseSpec({ durationS: 4500, seed: 3, noiseC: 0.1 }),
    loadEndS: 3600,
    clock: { name: 'CPU clock [MHz]', mhz: 4600, idleMhz: 1200, noiseMhz: 10 },
    power: { name: 'Package power [W]', watts: 200, idleWatts: 30, noiseW: 1 },
    ...overrides,
  };
}

const analyse = analyseSpec;

describe('the end of the load', () => {
  it('is where package power and the clock fall to idle together, found on plain series', () => {
    const count = 200;
    const timeS = Float64Array.from({ length: count }, (_, i) => i);
    const powerW = Float64Array.from({ length: count }, (_, i) => (i < 20 ? 30 : i < 150 ? 200 : 30));
    const clockMHz = Float64Array.from({ length: count }, (_, i) => (i < 150 ? 4600 : 1200));
    const signals = { timeS, powerW, clockMHz, loadStartIndex: 20, throttleFraction: 0.85, intervalS: 1 };
    expect(detectLoadEndIndex(signals)).toBe(150);
    expect(detectLoadEndIndex({ ...signals, clockMHz: null })).toBe(150);
    // The clock fell 40 s before the power: a throttle under load, not the end of it.
    const earlyClock = Float64Array.from({ length: count }, (_, i) => (i < 110 ? 4600 : 1200));
    expect(detectLoadEndIndex({ ...signals, clockMHz: earlyClock })).toBe(count);
    // A step down to a long-term power limit (half the load) is no return to idle.
    const limited = Float64Array.from({ length: count }, (_, i) => (i < 20 ? 30 : i < 150 ? 200 : 100));
    expect(detectLoadEndIndex({ ...signals, powerW: limited, clockMHz: null })).toBe(count);
    // Without package power the end cannot be told from a throttle.
    expect(detectLoadEndIndex({ ...signals, powerW: null })).toBe(count);
  });

  it('when a log runs on into a cool-down tail, then the tail is no throttle and is left out of the analysis', () => {
    const analysis = analyse(soakWithTail());
    expect(analysis.loadEndSource).toBe('detected');
    expect(analysis.loadEndS).toBe(3600);
    expect(analysis.loggedS).toBe(4499);
    expect(analysis.soakS).toBe(3599);
    expect(analysis.throttle.detected).toBe(false);
    expect(analysis.reachedSteadyState).toBe(true);
    // First principles: 30 + 45·(1 − e^(−3599/420)) = 74.99 °C at the end of the load.
    expect(analysis.steadyStateMeanC!).toBeCloseTo(75, 0);
    expect(analysis.verdict).toMatchObject({ status: 'final', code: 'comfortable' });
  });

  it('when the clock drops while package power stays up, then that is a throttle', () => {
    const analysis = analyse(
      soakWithTail({
        durationS: 3600,
        loadEndS: undefined,
        clock: { name: 'CPU clock [MHz]', mhz: 4600, drop: { fromS: 3000, value: 2800 } },
      }),
    );
    expect(analysis.loadEndS).toBeNull();
    expect(analysis.throttle).toMatchObject({ detected: true, source: 'clock', firstAtS: 3000 });
    expect(analysis.verdict).toMatchObject({ status: 'final', code: 'throttled' });
  });

  it('when the clock fell long before the power did, then the run throttled under load', () => {
    const analysis = analyse(
      soakWithTail({
        clock: { name: 'CPU clock [MHz]', mhz: 4600, idleMhz: 1200, drop: { fromS: 3000, value: 2800 } },
      }),
    );
    expect(analysis.loadEndSource).toBe('none');
    expect(analysis.throttle).toMatchObject({ detected: true, firstAtS: 3000 });
    expect(analysis.verdict.code).toBe('throttled');
  });

  it('when only the clock is logged, then the tester sets the load end by hand and the tail is left out', () => {
    const clockOnly = { ...mapping, power: null };
    const spec = soakWithTail({ power: null });
    expect(analyse(spec, {}, clockOnly).throttle.detected).toBe(true);
    const analysis = analyse(spec, { loadEndS: 3600 }, clockOnly);
    expect(analysis).toMatchObject({ loadEndSource: 'manual', loadEndS: 3600, soakS: 3600 });
    expect(analysis.throttle.detected).toBe(false);
    expect(analysis.verdict).toMatchObject({ status: 'final', code: 'comfortable' });
  });

  it('refuses a load end before the load start, naming the field', () => {
    const parsed = analysisOptionsSchema.safeParse({ loadStartS: 600, loadEndS: 300 });
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0]).toMatchObject({
      path: ['loadEndS'],
      message: 'The load must end after it starts.',
    });
  });
});
