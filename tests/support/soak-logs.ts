import { expect } from 'vitest';
import { analyseLog } from '../../shared/domain/analysis/analyse-log';
import { syntheticLoggerLog, type SyntheticLogSpec } from '../../shared/generators/synthetic-logger-log';
import { analysisResultSchema, type AnalysisOptionsInput, type ColumnMapping } from '../../shared/schemas/analysis';

/** The columns of a generated log with two VRM probes, the room, the clock and the package power. */
export const twoProbeMapping: ColumnMapping = {
  vrm: ['VRM 1 [°C]', 'VRM 2 [°C]'],
  ambient: 'Ambient [°C]',
  clock: 'CPU clock [MHz]',
  power: 'Package power [W]',
};

/**
 * Two VRM probes at 1 Hz rising first-order from 30 °C (VRM 1 by `vrm1RiseC` with τ = 420 s, VRM 2 by 40 °C with
 * τ = 400 s), each with `noiseC` of noise, in a 21 °C room under a steady 4600 MHz clock: the soak the analysis tests
 * start from, adding power, a load end or a fault where they need one.
 */
export function twoProbeRiseSpec({
  durationS,
  seed,
  noiseC,
  vrm1RiseC = 45,
}: {
  durationS: number;
  seed: number;
  noiseC: number;
  vrm1RiseC?: number;
}): SyntheticLogSpec {
  return {
    durationS,
    sampleHz: 1,
    seed,
    probes: [
      { name: 'VRM 1', startC: 30, riseC: vrm1RiseC, tauS: 420, noiseC },
      { name: 'VRM 2', startC: 30, riseC: 40, tauS: 400, noiseC },
    ],
    ambient: { name: 'Ambient', startC: 21, noiseC: 0.05 },
    clock: { name: 'CPU clock [MHz]', mhz: 4600, noiseMhz: 10 },
  };
}

/** A generated log analysed; the result must be the API document, and a refused log fails with its errors. */
export function analyseSpec(
  spec: SyntheticLogSpec,
  options: AnalysisOptionsInput = {},
  mapping: ColumnMapping = twoProbeMapping,
) {
  const outcome = analyseLog(syntheticLoggerLog(spec), { mapping, options });
  if (!outcome.ok) throw new Error(JSON.stringify(outcome.errors));
  expect(analysisResultSchema.safeParse(outcome.analysis).success).toBe(true);
  return outcome.analysis;
}

/** An hour at 1 Hz with three VRM probes; VRM 3 reads OPEN from the first sample to the last (a dead probe). */
export function deadThirdProbeSpec(): SyntheticLogSpec {
  return {
    durationS: 3600,
    sampleHz: 1,
    seed: 9,
    probes: [
      { name: 'VRM 1', startC: 30, riseC: 45, tauS: 420 },
      { name: 'VRM 2', startC: 30, riseC: 40, tauS: 400 },
      { name: 'VRM 3', startC: 30, riseC: 40, tauS: 400, dropouts: [{ fromS: 0, toS: 3600, marker: 'OPEN' }] },
    ],
    ambient: { name: 'Ambient', startC: 21 },
    clock: { name: 'CPU clock [MHz]', mhz: 4600 },
  };
}
