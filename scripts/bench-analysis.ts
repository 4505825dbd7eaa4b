/**
 * Benchmark of the measurement engine (issue 3): a one-hour log at 10 Hz with eight channels (36,000 rows), timed as
 * papaparse alone and as the whole engine (parse + mapping + analysis), medians over interleaved rounds in one run.
 * Targets: the engine adds less than 1× the raw parse time, and the whole stays well under half a second.
 */
import Papa from 'papaparse';
import { previewAndAnalyze } from '../shared/domain/preview-and-analyze';
import { syntheticLoggerLog } from '../shared/domain/synthetic-logger-log';

const rounds = 15;
const warmUpRounds = 3;

const text = syntheticLoggerLog({
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
  preamble: ['Benchwire bench log', 'Sample interval: 0.1 s'],
});
const rows = text.split('\n').length - 4;
const request = {
  mapping: {
    vrm: ['VRM 1 [°C]', 'VRM 2 [°C]', 'VRM 3 [°C]', 'VRM 4 [°C]', 'VRM 5 [°C]'],
    ambient: 'Ambient [°C]',
    clock: 'CPU clock [MHz]',
    power: 'Package power [W]',
  },
};

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** papaparse as the engine calls it: explicit delimiter, cells as strings. */
function timePapaparse(): number {
  const started = performance.now();
  const parsed = Papa.parse<string[]>(text, { delimiter: ',', skipEmptyLines: false });
  const elapsed = performance.now() - started;
  if (parsed.data.length < rows) throw new Error('papaparse returned too few rows');
  return elapsed;
}

function timeEngine(): number {
  const started = performance.now();
  const outcome = previewAndAnalyze(text, request);
  const elapsed = performance.now() - started;
  if (!outcome.ok) throw new Error(`The benchmark log did not parse: ${outcome.errors[0].message}`);
  return elapsed;
}

// Each result is dropped before the next timing, and the order alternates, so neither side pays for collecting the
// other's garbage more often.
const parseTimes: number[] = [];
const engineTimes: number[] = [];
for (let round = 0; round < warmUpRounds + rounds; round++) {
  const engineFirst = round % 2 === 1;
  const engineMs = engineFirst ? timeEngine() : Number.NaN;
  const parseMs = timePapaparse();
  const engineMsAfter = engineFirst ? engineMs : timeEngine();
  if (round >= warmUpRounds) {
    parseTimes.push(parseMs);
    engineTimes.push(engineMsAfter);
  }
}

const parseMs = median(parseTimes);
const engineMs = median(engineTimes);
const addedRatio = (engineMs - parseMs) / parseMs;
const meetsTargets = addedRatio < 1 && engineMs < 500;
console.log(
  `Benchwire analysis benchmark: ${rows.toLocaleString('en')} rows × 8 channels, ${(text.length / 1e6).toFixed(2)} MB, median of ${rounds} rounds`,
);
console.log(`  papaparse alone            ${parseMs.toFixed(1).padStart(7)} ms`);
console.log(`  parse + full analysis      ${engineMs.toFixed(1).padStart(7)} ms`);
console.log(`  ratio (engine / parse)     ${(engineMs / parseMs).toFixed(2).padStart(7)}×`);
console.log(`  analysis adds              ${addedRatio.toFixed(2).padStart(7)}× the parse time (target < 1×)`);
console.log(`  ${meetsTargets ? 'PASS' : 'FAIL'}: target is added < 1× parse and whole < 500 ms`);
process.exitCode = meetsTargets ? 0 : 1;
