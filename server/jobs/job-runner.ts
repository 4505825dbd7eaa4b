import { randomBytes } from 'node:crypto';
import { hostname } from 'node:os';
import type { DataSource } from 'typeorm';
import { systemClock, type Clock } from './clock';
import { defaultBackoffMs, PermanentJobError, RetryJobLater, type JobRegistry } from './job-registry';
import { retryingDeadlocks } from '../lib/database-errors';

export interface JobRunnerOptions {
  clock?: Clock;
  /** How often the runner looks for due jobs (about once a second by default). */
  pollIntervalMs?: number;
  /** A job still marked running this long after it was claimed is taken to be abandoned (its process died). */
  leaseMs?: number;
  /** Claim only the jobs with these unique keys (tests that share a database with other runners). */
  onlyUniqueKeys?: string[];
  /** Where failures are reported; the server's console by default. */
  log?: Pick<Console, 'error' | 'warn'>;
}

interface ClaimedRow {
  id: string | number;
  kind: string;
  unique_key: string | null;
  payload: string | object | null;
  run_at: Date;
  attempts: number;
  max_attempts: number;
}

/**
 * Runs due jobs from the `jobs` table inside the server process. Each claim is a short transaction with
 * SELECT … FOR UPDATE SKIP LOCKED, so several processes share the queue and never claim the same job; the claim
 * marks the job running with a lease, and a job whose process died is claimed again once its lease runs out.
 * Handlers are therefore at-least-once and must be idempotent (publishing, for one, is made a no-op the second
 * time by a unique key). Overdue jobs run as soon as the runner starts.
 */
export class JobRunner {
  readonly workerId = `${hostname()}:${process.pid}:${randomBytes(4).toString('hex')}`;
  readonly clock: Clock;
  private readonly pollIntervalMs: number;
  private readonly leaseMs: number;
  private readonly log: Pick<Console, 'error' | 'warn'>;
  private readonly onlyUniqueKeys: string[] | null;
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<number> | null = null;
  private stopped = true;
  private stopRequested = false;

  constructor(
    private readonly dataSource: DataSource,
    private readonly registry: JobRegistry,
    options: JobRunnerOptions = {},
  ) {
    this.clock = options.clock ?? systemClock;
    this.pollIntervalMs = options.pollIntervalMs ?? 1_000;
    this.leaseMs = options.leaseMs ?? 5 * 60_000;
    this.log = options.log ?? console;
    this.onlyUniqueKeys = options.onlyUniqueKeys ?? null;
  }

  /** Starts polling; the first look happens now, so jobs that fell due while no server ran go first. */
  start(): void {
    if (!this.stopped) return;
    this.stopped = false;
    this.stopRequested = false;
    this.schedule(0);
  }

  /** Stops polling and waits for the job in hand to finish. */
  async stop(): Promise<void> {
    this.stopped = true;
    this.stopRequested = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    await this.running?.catch(() => 0);
  }

  /** Claims and runs every job due by the clock's now, one after another; resolves with how many ran. */
  runDue(): Promise<number> {
    // One pass at a time per runner: a second caller waits for the pass in progress, then runs its own.
    const previous = this.running ?? Promise.resolve(0);
    const pass = previous.catch(() => 0).then(() => this.drain());
    this.running = pass;
    return pass;
  }

  private schedule(delayMs: number) {
    if (this.stopped) return;
    this.timer = setTimeout(() => {
      this.timer = null;
      this.runDue()
        .catch((error: unknown) => this.log.error('[jobs] could not look for due jobs:', error))
        .finally(() => this.schedule(this.pollIntervalMs));
    }, delayMs);
  }

  private async drain(): Promise<number> {
    let count = 0;
    const kinds = this.registry.kindNames();
    // A stop request ends the pass between jobs, never mid-job.
    while (kinds.length > 0 && !this.stopRequested) {
      const job = await this.claim(kinds);
      if (!job) break;
      await this.execute(job);
      count += 1;
    }
    return count;
  }

  private async claim(kinds: string[]): Promise<ClaimedRow | null> {
    const now = this.clock.now();
    const abandonedBefore = new Date(now.getTime() - this.leaseMs);
    // Two runners claiming at once can deadlock on the index locks of the claim's UPDATE; the loser claims again.
    return retryingDeadlocks(() =>
      this.dataSource.transaction(async (manager) => {
        const placeholders = kinds.map(() => '?').join(', ');
        const keys = this.onlyUniqueKeys;
        const keyFilter = keys ? `AND unique_key IN (${keys.map(() => '?').join(', ') || 'NULL'})` : '';
        const rows: ClaimedRow[] = await manager.query(
          `SELECT id, kind, unique_key, payload, run_at, attempts, max_attempts FROM jobs
         WHERE kind IN (${placeholders}) ${keyFilter}
           AND ((state = 'pending' AND run_at <= ?) OR (state = 'running' AND locked_at <= ?))
         ORDER BY run_at, id
         LIMIT 1
         FOR UPDATE SKIP LOCKED`,
          [...kinds, ...(keys ?? []), now, abandonedBefore],
        );
        const row = rows[0];
        if (!row) return null;
        await manager.query(
          `UPDATE jobs SET state = 'running', locked_by = ?, locked_at = ?, attempts = attempts + 1 WHERE id = ?`,
          [this.workerId, now, row.id],
        );
        return { ...row, attempts: row.attempts + 1 };
      }),
    );
  }

  private async execute(row: ClaimedRow): Promise<void> {
    const spec = this.registry.get(row.kind);
    const id = String(row.id);
    const maxAttempts = spec?.maxAttempts ?? row.max_attempts;
    try {
      if (!spec) throw new PermanentJobError(`No handler for the job kind “${row.kind}”.`);
      const raw = typeof row.payload === 'string' ? (JSON.parse(row.payload) as unknown) : row.payload;
      const parsed = spec.payload.safeParse(raw);
      if (!parsed.success) throw new PermanentJobError(`The job's payload is not valid: ${parsed.error.message}`);
      if (row.attempts > maxAttempts) throw new PermanentJobError('The job was abandoned too many times.');
      await spec.handler({
        job: {
          id,
          kind: row.kind,
          uniqueKey: row.unique_key,
          payload: parsed.data,
          attempts: row.attempts,
          runAt: row.run_at,
        },
        now: this.clock.now(),
        clock: this.clock,
      });
      await this.dataSource.query(
        `UPDATE jobs SET state = 'done', finished_at = ?, locked_by = NULL, locked_at = NULL, last_error = NULL
         WHERE id = ? AND state = 'running' AND locked_by = ?`,
        [this.clock.now(), id, this.workerId],
      );
    } catch (error) {
      const message = error instanceof Error ? `${error.name}: ${error.message}` : String(error);
      const permanent = error instanceof PermanentJobError || row.attempts >= maxAttempts;
      if (permanent) {
        this.log.error(`[jobs] ${row.kind} #${id} failed for good after ${row.attempts} attempt(s): ${message}`);
        await this.dataSource.query(
          `UPDATE jobs SET state = 'failed', finished_at = ?, locked_by = NULL, locked_at = NULL, last_error = ?
           WHERE id = ? AND locked_by = ?`,
          [this.clock.now(), message.slice(0, 10_000), id, this.workerId],
        );
        return;
      }
      const delay =
        error instanceof RetryJobLater ? error.delayMs : (spec?.backoffMs ?? defaultBackoffMs)(row.attempts);
      this.log.warn(`[jobs] ${row.kind} #${id} attempt ${row.attempts} failed, retrying in ${delay} ms: ${message}`);
      await this.dataSource.query(
        `UPDATE jobs SET state = 'pending', run_at = ?, locked_by = NULL, locked_at = NULL, last_error = ?
         WHERE id = ? AND locked_by = ?`,
        [new Date(this.clock.now().getTime() + delay), message.slice(0, 10_000), id, this.workerId],
      );
    }
  }
}
