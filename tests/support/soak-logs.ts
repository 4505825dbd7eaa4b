import type { SyntheticLogSpec } from '../../shared/generators/synthetic-logger-log';

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
