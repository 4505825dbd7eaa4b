import { In, type DataSource } from 'typeorm';
import { BenchBookingCellEntity } from '../entities/bench-booking-cell.entity';
import { BenchBookingEntity } from '../entities/bench-booking.entity';
import { BenchEntity } from '../entities/bench.entity';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { ProductEntity } from '../entities/product.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { UserEntity } from '../entities/user.entity';
import { analyseInProcess } from '../services/log-check.service';
import { TestRunsService } from '../services/test-runs.service';
import type { FileStore } from '../storage/file-store';
import { syntheticLoggerLog, type SyntheticLogSpec } from '../../shared/generators/synthetic-logger-log';
import type { CurrentUser } from '../../shared/schemas/auth';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

/** The demo bench's logger columns, as the seeded bench profile remembers them. */
const mapping = {
  time: 'Time [s]',
  vrm: ['VRM 1 [°C]', 'VRM 2 [°C]'],
  ambient: 'Ambient [°C]',
  clock: 'CPU clock',
  power: 'Package power',
};

/** A stable number in [0, 1) from a board's model name, so each invented board runs a little hotter or cooler. */
function boardFactor(model: string) {
  let hash = 2166136261;
  for (const char of model) hash = Math.imul(hash ^ char.charCodeAt(0), 16777619);
  return ((hash >>> 0) % 1000) / 1000;
}

interface DemoRun {
  firmware: string;
  /** Changes to the first-order model or the log for this run. */
  adjust?: (spec: SyntheticLogSpec) => void;
  review?: { decision: 'accept' | 'send-back'; reason?: string };
  ofRecord?: boolean;
}

/**
 * An invented log per run from a first-order thermal model of each board under each configuration's package power,
 * with ambient noise: the rise over ambient is package power × a per-board thermal resistance (0.14–0.26 °C/W, an
 * invented spread), τ 9–14 min, one hour's soak after two idle minutes, logged at 1 Hz.
 */
function demoLog(model: string, packagePowerW: number, seed: number, adjust?: DemoRun['adjust']) {
  const factor = boardFactor(model);
  const resistance = 0.14 + 0.12 * factor;
  const spec: SyntheticLogSpec = {
    durationS: 3720,
    sampleHz: 1,
    seed,
    loadStartS: 120,
    probes: [
      { name: 'VRM 1', startC: 21.2, riseC: packagePowerW * resistance, tauS: 540 + 300 * factor, noiseC: 0.08 },
      { name: 'VRM 2', startC: 21.1, riseC: packagePowerW * resistance * 0.93, tauS: 600 + 300 * factor, noiseC: 0.08 },
    ],
    ambient: { name: 'Ambient', startC: 20.9, driftC: 0.3, noiseC: 0.05 },
    clock: { name: 'CPU clock', mhz: packagePowerW > 300 ? 5200 : packagePowerW > 250 ? 5000 : 4650, noiseMhz: 8 },
    power: { name: 'Package power', watts: packagePowerW, idleWatts: 28, noiseW: 1.5 },
  };
  adjust?.(spec);
  return Buffer.from(syntheticLoggerLog(spec), 'utf8');
}

/** Special runs of the demo; every other recorded or accepted cell gets one plain run on firmware 1.04. */
const specialRuns: Record<string, DemoRun[]> = {
  // A retest after a firmware update: the newer firmware runs cooler and stands for the cell.
  'KV Ridgeline B70:2': [
    { firmware: '1.04', adjust: (s) => (s.probes[0].riseC *= 1.08), review: { decision: 'accept' } },
    { firmware: '1.06', review: { decision: 'accept' }, ofRecord: true },
  ],
  // The stress configuration throttles: the clock falls and stays down 40 minutes in.
  'Holloway B70 Plus:1': [
    {
      firmware: '1.04',
      adjust: (s) => {
        s.clock = { name: 'CPU clock', mhz: 5000, noiseMhz: 8, drop: { fromS: 2520, value: 3900 } };
      },
    },
  ],
  // A soak stopped at 35 minutes: flagged short, its verdict withheld or provisional.
  'Cinderline B70:0': [{ firmware: '1.03', adjust: (s) => (s.durationS = 120 + 35 * 60) }],
  // The room drifted during the soak; the editor sent it back.
  'Q-Marlpit B70:0': [
    {
      firmware: '1.04',
      adjust: (s) => (s.ambient = { name: 'Ambient', startC: 21.0, driftC: 2.4, noiseC: 0.05 }),
      review: {
        decision: 'send-back',
        reason: 'Room drifted to 23.4 °C during the soak; run it again with the door shut.',
      },
    },
  ],
};

/**
 * Gives the demo's recorded, accepted and sent-back cells stored runs through the same service the app uses: a past
 * booking on a bench for each, a generated logger file, the analysis, and the editor's review and run of record.
 */
export async function seedDemoRuns(dataSource: DataSource, files: FileStore, now = new Date()) {
  const runs = new TestRunsService(dataSource, files, analyseInProcess);
  const users = await dataSource.getRepository(UserEntity).find();
  const actorOf = (user: UserEntity): CurrentUser => ({
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
  });
  const editor = users.find((u) => u.role === 'editor');
  if (!editor) return 0;
  const cells = await dataSource
    .getRepository(MatrixCellEntity)
    .find({ where: { state: In(['recorded', 'accepted', 'needs-retest']) }, order: { id: 'ASC' } });
  const entries = await dataSource.getRepository(RoundupEntryEntity).findBy({ id: In(cells.map((c) => c.entryId)) });
  const products = await dataSource.getRepository(ProductEntity).findBy({ id: In(entries.map((e) => e.productId)) });
  const configurations = await dataSource.getRepository(LoadConfigurationEntity).find();
  const [bench] = await dataSource.getRepository(BenchEntity).find({ order: { id: 'ASC' }, take: 1 });
  const configColumn = new Map<number, number>();
  for (const [index, configuration] of configurations.entries()) configColumn.set(configuration.id, index);
  let made = 0;
  for (const [index, cell] of cells.entries()) {
    const tester = users.find((u) => u.id === cell.testerId);
    const entry = entries.find((e) => e.id === cell.entryId);
    const product = products.find((p) => p.id === entry?.productId);
    const configuration = configurations.find((c) => c.id === cell.loadConfigurationId);
    if (!tester || !product || !configuration || !bench) continue;
    const key = `${product.model}:${configColumn.get(configuration.id)}`;
    const plan = specialRuns[key] ?? [
      { firmware: '1.04', review: cell.state === 'accepted' ? { decision: 'accept' } : undefined },
    ];
    // The plan seeded the cell's final state; runs are added while it is open, then the state is put back.
    await dataSource.getRepository(MatrixCellEntity).update({ id: cell.id }, { state: 'running' });
    for (const [runIndex, demo] of plan.entries()) {
      // A past booking on the first bench, two hours long, days apart for each cell.
      const startsAt = new Date(now.getTime() - (40 - index) * DAY_MS - (runIndex + 1) * 3 * HOUR_MS);
      const { identifiers } = await dataSource.getRepository(BenchBookingEntity).insert({
        benchId: bench.id,
        testerId: tester.id,
        startsAt,
        endsAt: new Date(startsAt.getTime() + 2 * HOUR_MS),
        note: 'Soak',
      });
      const bookingId = Number(identifiers[0].id);
      await dataSource.getRepository(BenchBookingCellEntity).insert({ bookingId, cellId: cell.id });
      const runId = await runs.createLoggerRun(
        actorOf(tester),
        cell.id,
        {
          originalname: `${product.model.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${configColumn.get(configuration.id)}-${demo.firmware}.csv`,
          buffer: demoLog(
            product.model,
            Number(configuration.expectedPackagePowerW),
            cell.id * 10 + runIndex,
            demo.adjust,
          ),
        },
        {
          firmwareVersion: demo.firmware,
          benchId: bench.id,
          startedAt: new Date(startsAt.getTime() + 10 * 60_000).toISOString(),
          notes: null,
          outsideBookingReason: null,
          mapping,
          options: undefined,
          rememberMapping: true,
        },
      );
      made++;
      if (demo.review) {
        const flagged = (await runs.run(runId, actorOf(editor))).analysis.flags.some((f) => f.severity === 'warning');
        await runs.review(actorOf(editor), runId, {
          decision: demo.review.decision,
          reason:
            demo.review.reason ??
            (flagged ? 'Checked the log by eye: the flagged stretch does not change the peak.' : null),
        });
      }
      if (demo.ofRecord || (plan.length === 1 && cell.state === 'accepted')) {
        await runs.markRunOfRecord(actorOf(editor), runId);
      }
    }
    await dataSource.getRepository(MatrixCellEntity).update({ id: cell.id }, { state: cell.state, note: cell.note });
  }
  return made;
}
