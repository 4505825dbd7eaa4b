/**
 * Benchmark of the measurement engine (issue 3): a one-hour log at 10 Hz with eight channels (36,000 rows), timed as
 * papaparse alone and as the whole engine (parse + mapping + analysis), medians over several blocks in one run.
 * Targets: the engine adds less than 1× the raw parse time, and the whole stays well under half a second.
 *
 * Then the server's responsiveness: the worst file Log check accepts is uploaded to an HTTP server in this process
 * (the one upload middleware and the Log check service), and a health route on the same server is asked every 20 ms
 * while the file is analysed — once with the analysis in the worker pool as the server runs it, once in the event
 * loop as the baseline. Target (issue 12's wording): every health answer within 100 ms while the pool analyses. The
 * longest, 99th and 95th percentile answers are printed, with the load average and the worker threads' priority.
 */
import type { AddressInfo } from 'node:net';
import { readdirSync, readFileSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import express from 'express';
import Papa from 'papaparse';
import { errorHandler } from '../server/middleware/error-handler';
import { acceptUpload } from '../server/middleware/upload';
import {
  analyseInProcess,
  LogCheckService,
  pooledAnalyser,
  type LogFileAnalyser,
} from '../server/services/log-check.service';
import { worstAcceptedLog } from '../shared/generators/worst-accepted-log';
import { logFileUploadLimit } from '../shared/upload-limits';
import { analyseLog } from '../shared/domain/analysis/analyse-log';
import { benchSoakLog, benchSoakMapping, median } from './lib/soak-log';

// A full collection between blocks (not inside any timing), so no block starts with the previous one's garbage.
setFlagsFromString('--expose-gc');
const collectGarbage = runInNewContext('gc') as () => void;

/** Alternating blocks of timings of one kind; the first runs of each block are not counted (see below). */
const blocks = 3;
const countedPerBlock = 7;
const settlingRuns = 2;
const rounds = blocks * countedPerBlock;

const text = benchSoakLog();
const rows = text.split('\n').length - 4;
const request = { mapping: benchSoakMapping };

/** papaparse as the engine calls it: explicit delimiter, cells as strings. */
function timePapaparse(): number {
  const started = performance.now();
  const parsed = Papa.parse<string[]>(text, { delimiter: ',', skipEmptyLines: false });
  const elapsed = performance.now() - started;
  if (parsed.data.length < rows) throw new Error('papaparse returned too few rows');
  return elapsed;
}

/** papaparse as the engine streams it: the same chunks, each row dropped after a glance. */
function timePapaparseStreamed(): number {
  let seen = 0;
  const started = performance.now();
  Papa.parse<string[]>(text, {
    delimiter: ',',
    skipEmptyLines: false,
    chunkSize: 256 * 1024,
    complete: () => undefined,
    chunk: (results: Papa.ParseResult<string[]>) => {
      seen += results.data.length;
    },
  });
  const elapsed = performance.now() - started;
  if (seen < rows) throw new Error('papaparse streamed too few rows');
  return elapsed;
}

function timeEngine(): number {
  const started = performance.now();
  const outcome = analyseLog(text, request);
  const elapsed = performance.now() - started;
  if (!outcome.ok) throw new Error(`The benchmark log did not parse: ${outcome.errors[0].message}`);
  return elapsed;
}

// Timed in alternating blocks. The sides leave very different garbage behind (papaparse alone returns every row as
// strings; the engine keeps only numbers), so each block starts from a collected heap and its first runs are not
// counted. Each median then holds the side's own cost, its own collections included.
const parseTimes: number[] = [];
const streamedTimes: number[] = [];
const engineTimes: number[] = [];
for (let block = 0; block < blocks; block++) {
  for (const [timings, timeOnce] of [
    [parseTimes, timePapaparse],
    [streamedTimes, timePapaparseStreamed],
    [engineTimes, timeEngine],
  ] as const) {
    collectGarbage();
    for (let run = 0; run < settlingRuns + countedPerBlock; run++) {
      const elapsed = timeOnce();
      if (run >= settlingRuns) timings.push(elapsed);
    }
  }
}

const parseMs = median(parseTimes);
const streamedMs = median(streamedTimes);
const engineMs = median(engineTimes);
const addedRatio = (engineMs - parseMs) / parseMs;
const meetsTargets = addedRatio < 1 && engineMs < 500;
const line = (label: string, value: string) => console.log(`  ${label.padEnd(44)}${value}`);
console.log(
  `Benchwire analysis benchmark: ${rows.toLocaleString('en')} rows × 8 channels, ${(text.length / 1e6).toFixed(2)} MB, median of ${rounds} runs each`,
);
line('papaparse alone (every row kept as strings)', `${parseMs.toFixed(1).padStart(7)} ms`);
line('parse + full analysis', `${engineMs.toFixed(1).padStart(7)} ms`);
line('ratio, engine / papaparse alone', `${(engineMs / parseMs).toFixed(2).padStart(7)}×`);
line('analysis adds', `${addedRatio.toFixed(2).padStart(7)}× the parse time (target < 1×)`);
// The engine streams the rows instead of keeping them, which is why it can beat papaparse alone; its own parse and
// what the analysis costs on top of it are shown too, so the saving is not mistaken for a free analysis.
line('for reference: papaparse streamed as the engine', `${streamedMs.toFixed(1).padStart(7)} ms`);
line('for reference: engine over its streamed parse', `${(engineMs / streamedMs).toFixed(2).padStart(7)}×`);
line(
  'load average',
  `${loadavg()[0].toFixed(1).padStart(7)} on ${availableParallelism()} cores (other work slows every side)`,
);

interface Responsiveness {
  analysisMs: number;
  answers: number;
  medianMs: number;
  p95Ms: number;
  p99Ms: number;
  maxMs: number;
  /** Niceness of this process's threads while the analysis ran (Linux), the lowest and the highest. */
  niceness: { lowest: number; highest: number } | null;
}

/** The lowest and highest niceness among this process's threads (Linux /proc; null elsewhere). */
function threadNiceness(): { lowest: number; highest: number } | null {
  try {
    const values = readdirSync('/proc/self/task').map((thread) => {
      const stat = readFileSync(`/proc/self/task/${thread}/stat`, 'utf8');
      // Field 19 of proc(5) is the nice value; the fields after the command name start at field 3.
      return Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[16]);
    });
    return { lowest: Math.min(...values), highest: Math.max(...values) };
  } catch {
    return null;
  }
}

function percentile(values: number[], share: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(share * sorted.length))];
}

/** Health answers while one worst-case file is analysed by `analyser` on a server in this process. */
async function healthWhileAnalysing(file: Blob, analyser: LogFileAnalyser): Promise<Responsiveness> {
  const logCheck = new LogCheckService(analyser);
  // A server that has analysed one file before: the worker thread is up (its start is not what is measured).
  await logCheck.analyse({ originalname: 'warm-up.csv', buffer: Buffer.from('Time,VRM 1\n0,40\n1,41\n2,42\n') }, {});
  const analysis = { startedAt: Number.NaN, endedAt: Number.NaN };
  const app = express();
  app.get('/api/health', (_req, res) => {
    res.json({ status: 'ok' });
  });
  app.post(
    '/api/log-check/analyse',
    ...acceptUpload({ fields: { file: 'file' }, limit: logFileUploadLimit }),
    (req, res, next) => {
      analysis.startedAt = performance.now();
      logCheck
        .analyse(req.file, {})
        .then((answer) => {
          analysis.endedAt = performance.now();
          res.json({ verdict: answer.analysis.verdict.code });
        })
        .catch(next);
    },
  );
  app.use(errorHandler);
  const server = app.listen(0, '127.0.0.1');
  // A held event loop must not also close the client's idle keep-alive connection under it.
  server.keepAliveTimeout = 600_000;
  await new Promise((resolve) => server.once('listening', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  try {
    const form = new FormData();
    form.append('file', file, 'worst.csv');
    let done = false;
    const upload = fetch(`${base}/api/log-check/analyse`, { method: 'POST', body: form }).then(async (response) => {
      done = true;
      if (!response.ok) throw new Error(`The worst accepted file was refused: ${await response.text()}`);
    });
    const rounds: { started: number; ended: number }[] = [];
    let niceness: Responsiveness['niceness'] = null;
    while (!done) {
      if (rounds.length === 10) niceness = threadNiceness();
      // Each round: wait 20 ms, ask for /api/health. A held event loop delays the timer and the answer alike.
      const started = performance.now();
      await new Promise((resolve) => setTimeout(resolve, 20));
      await (await fetch(`${base}/api/health`)).json();
      rounds.push({ started, ended: performance.now() });
    }
    await upload;
    // The rounds that overlapped the analysis, less their 20 ms wait.
    const latencies = rounds
      .filter((round) => round.ended > analysis.startedAt && round.started < analysis.endedAt)
      .map((round) => round.ended - round.started - 20);
    return {
      analysisMs: analysis.endedAt - analysis.startedAt,
      answers: latencies.length,
      medianMs: latencies.length ? median(latencies) : Number.NaN,
      p95Ms: latencies.length ? percentile(latencies, 0.95) : Number.NaN,
      p99Ms: latencies.length ? percentile(latencies, 0.99) : Number.NaN,
      maxMs: latencies.length ? Math.max(...latencies) : Number.NaN,
      niceness,
    };
  } finally {
    server.close();
    if ('close' in analyser) await (analyser as { close: () => Promise<void> }).close();
  }
}

console.log(
  `  ${meetsTargets ? 'PASS' : 'FAIL'}: analysis adds < 1× the papaparse time and the whole stays under 500 ms`,
);

const worstText = worstAcceptedLog();
const worstFile = new Blob([worstText]);
console.log(
  `\nServer responsiveness: the worst accepted file (${(worstText.split('\n').length - 1).toLocaleString('en')} rows, ${(worstFile.size / 1e6).toFixed(1)} MB) analysed while /api/health is asked every 20 ms`,
);
const pooled = await healthWhileAnalysing(worstFile, pooledAnalyser({ timeBudgetMs: 600_000 }));
const blocking = await healthWhileAnalysing(worstFile, analyseInProcess);
const report = (label: string, figures: Responsiveness) =>
  line(
    label,
    `longest ${figures.maxMs.toFixed(1)} ms, 99 % within ${figures.p99Ms.toFixed(1)} ms, 95 % within ` +
      `${figures.p95Ms.toFixed(1)} ms, median ${figures.medianMs.toFixed(1)} ms ` +
      `(${figures.answers} answers over ${(figures.analysisMs / 1000).toFixed(1)} s)`,
  );
report('analysis in the worker pool (as served)', pooled);
report('baseline: analysis in the event loop', blocking);
if (pooled.niceness) {
  line(
    'thread priority during the pooled analysis',
    `nice ${pooled.niceness.lowest} (event loop) to ${pooled.niceness.highest} (analysis worker)`,
  );
}
line(
  'load average',
  `${loadavg()
    .map((value) => value.toFixed(1))
    .join(' / ')
    .padStart(7)} (1 / 5 / 15 min) on ${availableParallelism()} cores (other work on the machine delays every thread)`,
);
// Issue 12: every answer within 100 ms. The longest answer also holds the system's own scheduling delays, so a
// machine busy with other work can fail it whatever the server does; the baseline shows what a held event loop does
// instead (every answer waits for the whole analysis).
const responsive = pooled.answers >= 20 && pooled.maxMs < 100;
console.log(
  `  ${responsive ? 'PASS' : 'FAIL'}: every /api/health answer within 100 ms while the worst accepted file is analysed`,
);
process.exitCode = meetsTargets && responsive ? 0 : 1;
