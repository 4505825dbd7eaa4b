import { syntheticLoggerLog } from '../../shared/generators/synthetic-logger-log';

// The log the analysis and capture benchmarks send: an hour at 10 Hz (36,000 rows) with five VRM probes, ambient,
// CPU clock and package power — eight channels — after a minute of idle.

/** The benchmark log; `label` goes into its first line, so uploads with different labels differ in their hash. */
export function benchSoakLog(label = ''): string {
  return syntheticLoggerLog({
    durationS: 3600,
    sampleHz: 10,
    seed: 7,
    loadStartS: 60,
    probes: [1, 2, 3, 4, 5].map((index) => ({
      name: `VRM ${index}`,
      startC: 32,
      riseC: 40 + index * 3,
      tauS: 360 + index * 40,
      noiseC: 0.25,
    })),
    ambient: { name: 'Ambient', startC: 21, driftC: 0.4, noiseC: 0.05 },
    clock: { name: 'CPU clock [MHz]', mhz: 4600, noiseMhz: 15 },
    power: { name: 'Package power [W]', watts: 210, idleWatts: 35, noiseW: 2 },
    preamble: [label ? `Benchwire bench log ${label}` : 'Benchwire bench log', 'Sample interval: 0.1 s'],
  });
}

/** The benchmark log's columns mapped to their roles. */
export const benchSoakMapping = {
  vrm: ['VRM 1 [°C]', 'VRM 2 [°C]', 'VRM 3 [°C]', 'VRM 4 [°C]', 'VRM 5 [°C]'],
  ambient: 'Ambient [°C]',
  clock: 'CPU clock [MHz]',
  power: 'Package power [W]',
};

/** The middle value (the mean of the two middle ones for an even count). */
export function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}
