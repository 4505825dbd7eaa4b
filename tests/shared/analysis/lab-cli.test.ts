import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { syntheticLoggerLog } from '../../../shared/generators/synthetic-logger-log';
import { analysisResultSchema } from '../../../shared/schemas/analysis';

const run = promisify(execFile);
const tsx = join(process.cwd(), 'node_modules', '.bin', 'tsx');

async function lab(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { stdout, stderr } = await run(tsx, ['server/cli/lab.ts', ...args], { cwd: process.cwd() });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const failed = error as { code: number; stdout: string; stderr: string };
    return { code: failed.code, stdout: failed.stdout, stderr: failed.stderr };
  }
}

const folder = mkdtempSync(join(tmpdir(), 'benchwire-lab-'));

/** A generated logger log written to the test folder; its path. */
function logFile(name: string, options: Parameters<typeof syntheticLoggerLog>[0]): string {
  const file = join(folder, name);
  writeFileSync(file, syntheticLoggerLog(options));
  return file;
}

/** `lab analyse … --json`, which must exit 0, read as the API document. */
async function analyseJson(...args: string[]) {
  const result = await lab('analyse', ...args, '--json');
  expect(result.code).toBe(0);
  return analysisResultSchema.parse(JSON.parse(result.stdout));
}

describe('lab CLI', { timeout: 30_000 }, () => {
  it('converts type K both ways as JSON (NIST SRD 60 table: 100 °C → 4.096 mV)', async () => {
    const forward = await lab('tc', '--c', '100', '--json');
    expect(forward.code).toBe(0);
    expect(JSON.parse(forward.stdout).millivolts).toBeCloseTo(4.096, 3);
    // First principles from the NIST table values: E(100) − E(25) = 3.096 mV with the junction at 25 °C is 100 °C.
    const inverse = await lab('tc', '--mv', '3.096', '--cj', '25', '--json');
    expect(JSON.parse(inverse.stdout).celsius).toBeCloseTo(100, 1);
    const negative = await lab('tc', '--mv', '-3.554', '--json');
    // NIST SRD 60 table: −100 °C → −3.554 mV.
    expect(JSON.parse(negative.stdout).celsius).toBeCloseTo(-100, 1);
  });

  it('refuses an out-of-range voltage with exit status 1', async () => {
    const result = await lab('tc', '--mv', '70');
    expect(result.code).toBe(1);
    expect(result.stderr).toContain('outside the type K inverse function');
  });

  it('analyses a log and prints the API document with --json', async () => {
    const file = logFile('soak.csv', {
      durationS: 1800,
      sampleHz: 1,
      probes: [{ name: 'VRM 1', startC: 30, riseC: 45, tauS: 300 }],
      ambient: { name: 'Ambient', startC: 21 },
      clock: { name: 'CPU clock [MHz]', mhz: 4600, drop: { fromS: 900, value: 2000 } },
    });
    const analysis = await analyseJson(
      file,
      '--vrm',
      'VRM 1 [°C]',
      '--ambient',
      '3',
      '--clock',
      '4',
      '--soak-min',
      '30',
    );
    expect(analysis.throttle).toMatchObject({ detected: true, firstAtS: 900 });
    expect(analysis.verdict.code).toBe('throttled');
    expect(analysis.flags).toEqual([]);
    const table = await lab('analyse', file);
    expect(table.stdout).toContain('Verdict       Throttled');
    expect(table.stdout).toContain('guessed from the header');
  });

  it('withholds the verdict of an unfinished soak in JSON and text alike, and names QA flags in words', async () => {
    // A 10-minute log of a rise with τ = 15 min: 0.67 τ shown (first-order step response), far from its plateau.
    const file = logFile('short.csv', {
      durationS: 600,
      sampleHz: 1,
      probes: [{ name: 'VRM 1', startC: 65, riseC: 40, tauS: 900 }],
      ambient: { name: 'Ambient', startC: 21 },
      clock: { name: 'CPU clock [MHz]', mhz: 4600, idleMhz: 1200 },
      power: { name: 'Package power [W]', watts: 200, idleWatts: 30 },
      loadEndS: 480,
    });
    const analysis = await analyseJson(file, '--vrm', 'VRM 1 [°C]');
    expect(analysis.verdict).toMatchObject({ status: 'withheld', code: null, label: 'No verdict yet' });
    expect(analysis.loadEndSource).toBe('detected');
    const text = await lab('analyse', file, '--vrm', 'VRM 1 [°C]');
    expect(text.stdout).toContain('Verdict       No verdict yet');
    expect(text.stdout).toContain('- Soak shorter than required: withholds the verdict');
    expect(text.stdout).toContain('Load end      8\u2009min (package power fell to idle)');
    expect(text.stdout).not.toContain('soak-too-short');
    // The tester sets the load end by hand instead.
    const manual = await analyseJson(file, '--vrm', 'VRM 1 [°C]', '--load-end-min', '5');
    expect(manual).toMatchObject({ loadEndS: 300, soakS: 300 });
  });

  it('exits 1 with the precise parse errors on a bad log', async () => {
    const file = join(folder, 'bad.csv');
    writeFileSync(file, 'Time,VRM 1\n0,50\n2,51\n1,52\n');
    const result = await lab('analyse', file);
    expect(result.code).toBe(1);
    expect(result.stderr).toContain('[non-monotonic-time] Row 4, column "Time"');
  });

  it('exits 2 on wrong usage', async () => {
    expect((await lab('analyse')).code).toBe(2);
    expect((await lab('tc', '--mv', '1', '--c', '2')).code).toBe(2);
  });
});
