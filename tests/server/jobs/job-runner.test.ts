import { randomBytes } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import type { DataSource } from 'typeorm';
import { JobEntity } from '../../../server/entities/job.entity';
import { ManualClock, systemClock } from '../../../server/jobs/clock';
import { cancelJob, enqueueJob } from '../../../server/jobs/enqueue';
import { JobRegistry, PermanentJobError, RetryJobLater } from '../../../server/jobs/job-registry';
import { JobRunner, type JobRunnerOptions } from '../../../server/jobs/job-runner';
import { testDataSource } from '../support/test-app';

const quiet = { error: () => {}, warn: () => {} };
const payload = z.object({ n: z.number() });
let dataSource: DataSource;

/** A kind of its own per test, so runners of other tests sharing the database never claim these jobs. */
function kindName() {
  return `test-${randomBytes(4).toString('hex')}`;
}

async function jobsOf(kind: string) {
  return dataSource.getRepository(JobEntity).find({ where: { kind }, order: { id: 'ASC' } });
}

beforeAll(async () => {
  dataSource = await testDataSource();
});

/**
 * A queue of a kind of its own: a runner on a manual clock at 12:00 UTC on 1 March 2031 (the system clock with
 * `clock: systemClock`), and `enqueue` for jobs of that kind, due now unless told.
 */
function queueOf(kind: string, registry: JobRegistry, options: JobRunnerOptions = {}) {
  const clock = new ManualClock('2031-03-01T12:00:00.000Z');
  const runner = new JobRunner(dataSource, registry, { clock, log: quiet, ...options });
  const enqueue = (job: { payload: unknown; runAt?: Date; uniqueKey?: string }, onDuplicate?: 'replace') =>
    enqueueJob(dataSource.manager, { kind, ...job, runAt: job.runAt ?? clock.now() }, onDuplicate);
  return { clock, runner, enqueue };
}

/** A queue whose handler notes each job's `n` in `seen`. */
function recordingQueue(options: JobRunnerOptions = {}) {
  const kind = kindName();
  const seen: number[] = [];
  const registry = new JobRegistry().register(kind, {
    payload,
    handler: async ({ job }) => void seen.push(job.payload.n),
  });
  return { kind, seen, ...queueOf(kind, registry, options) };
}

describe('job runner', () => {
  it('runs a job only once its time has come, by the runner clock', async () => {
    const { kind, seen, clock, runner, enqueue } = recordingQueue();
    await enqueue({ payload: { n: 1 }, runAt: new Date('2031-03-01T12:00:10.000Z') });

    clock.set('2031-03-01T12:00:09.999Z');
    expect(await runner.runDue()).toBe(0);
    expect(seen).toEqual([]);

    clock.set('2031-03-01T12:00:10.000Z');
    expect(await runner.runDue()).toBe(1);
    expect(seen).toEqual([1]);
    const [job] = await jobsOf(kind);
    expect(job.state).toBe('done');
    expect(job.attempts).toBe(1);
    expect(job.lockedBy).toBeNull();
    expect(await runner.runDue()).toBe(0);
  });

  it('keeps one job per unique key; replace re-times it; cancel stops it', async () => {
    const { kind, seen, clock, runner, enqueue } = recordingQueue();
    const key = `${kind}:one`;
    await enqueue({ payload: { n: 1 }, uniqueKey: key });
    await enqueue({ payload: { n: 2 }, uniqueKey: key });
    expect(await jobsOf(kind)).toHaveLength(1);

    await enqueue({ payload: { n: 3 }, runAt: new Date('2031-03-01T13:00:00.000Z'), uniqueKey: key }, 'replace');
    expect(await runner.runDue()).toBe(0);
    clock.set('2031-03-01T13:00:00.000Z');
    expect(await runner.runDue()).toBe(1);
    expect(seen).toEqual([3]);

    const other = `${kind}:two`;
    await enqueue({ payload: { n: 4 }, uniqueKey: other });
    await cancelJob(dataSource.manager, other, clock.now());
    expect(await runner.runDue()).toBe(0);
    expect((await jobsOf(kind)).map((j) => j.state)).toEqual(['done', 'cancelled']);
  });

  it('retries a failed job with a growing delay, then succeeds', async () => {
    const kind = kindName();
    let calls = 0;
    const registry = new JobRegistry().register(kind, {
      payload,
      handler: async () => {
        calls += 1;
        if (calls < 3) throw new Error(`relay busy (${calls})`);
      },
    });
    const { clock, runner, enqueue } = queueOf(kind, registry);
    await enqueue({ payload: { n: 1 } });

    expect(await runner.runDue()).toBe(1);
    let [job] = await jobsOf(kind);
    expect(job.state).toBe('pending');
    expect(job.lastError).toContain('relay busy (1)');
    // Default back-off: 5 s after the first failure, 10 s after the second (server/jobs/job-registry.ts).
    expect(job.runAt.toISOString()).toBe('2031-03-01T12:00:05.000Z');

    clock.advance(4_999);
    expect(await runner.runDue()).toBe(0);
    clock.advance(1);
    expect(await runner.runDue()).toBe(1);
    [job] = await jobsOf(kind);
    expect(job.runAt.toISOString()).toBe('2031-03-01T12:00:15.000Z');

    clock.set(job.runAt);
    expect(await runner.runDue()).toBe(1);
    [job] = await jobsOf(kind);
    expect(job.state).toBe('done');
    expect(job.attempts).toBe(3);
    expect(job.lastError).toBeNull();
  });

  it('honours a handler that asks to retry later, and fails for good on a permanent error or too many attempts', async () => {
    const kind = kindName();
    const registry = new JobRegistry().register(kind, {
      payload,
      maxAttempts: 2,
      handler: async ({ job }) => {
        if (job.payload.n === 1) throw new RetryJobLater('try in a minute', 60_000);
        if (job.payload.n === 2) throw new PermanentJobError('address refused');
      },
    });
    const { clock, runner, enqueue } = queueOf(kind, registry);
    for (const jobPayload of [{ n: 1 }, { n: 2 }, { wrong: true }]) await enqueue({ payload: jobPayload });

    expect(await runner.runDue()).toBe(3);
    const [pending, refused, malformed] = await jobsOf(kind);
    expect(pending.state).toBe('pending');
    expect(pending.runAt.toISOString()).toBe('2031-03-01T12:01:00.000Z');
    expect(refused.state).toBe('failed');
    expect(refused.lastError).toContain('address refused');
    expect(malformed.state).toBe('failed');

    clock.advance(60_000);
    expect(await runner.runDue()).toBe(1);
    const [later] = await jobsOf(kind);
    expect(later.state).toBe('failed');
    expect(later.attempts).toBe(2);
  });

  it('two runners sharing the queue run each job exactly once', async () => {
    const kind = kindName();
    const runs = new Map<number, number>();
    const handler = async ({ job }: { job: { payload: { n: number } } }) => {
      runs.set(job.payload.n, (runs.get(job.payload.n) ?? 0) + 1);
      await new Promise((resolve) => setTimeout(resolve, 2));
    };
    const { clock, runner: first, enqueue } = queueOf(kind, new JobRegistry().register(kind, { payload, handler }));
    const second = new JobRunner(dataSource, new JobRegistry().register(kind, { payload, handler }), {
      clock,
      log: quiet,
    });
    for (let n = 0; n < 30; n += 1) await enqueue({ payload: { n } });
    const [a, b] = await Promise.all([first.runDue(), second.runDue()]);
    expect(a + b).toBe(30);
    expect([...runs.values()].every((count) => count === 1)).toBe(true);
    expect(runs.size).toBe(30);
  });

  it('takes over a job whose runner died once its lease has run out', async () => {
    const { kind, seen, clock, runner } = recordingQueue({ leaseMs: 60_000 });
    await dataSource.query(
      `INSERT INTO jobs (kind, payload, run_at, state, attempts, locked_by, locked_at)
       VALUES (?, '{"n":7}', ?, 'running', 1, 'a process that died', ?)`,
      [kind, clock.now(), clock.now()],
    );
    clock.advance(59_999);
    expect(await runner.runDue()).toBe(0);
    clock.advance(1);
    expect(await runner.runDue()).toBe(1);
    expect(seen).toEqual([7]);
    const [job] = await jobsOf(kind);
    expect(job.state).toBe('done');
    expect(job.attempts).toBe(2);
  });

  it('started, it runs overdue jobs at once and keeps polling until stopped', async () => {
    const { seen, runner, enqueue } = recordingQueue({ clock: systemClock, pollIntervalMs: 50 });
    await enqueue({ payload: { n: 1 }, runAt: new Date(Date.now() - 3_600_000) });
    runner.start();
    try {
      await expect.poll(() => seen, { timeout: 5_000 }).toEqual([1]);
      await enqueue({ payload: { n: 2 }, runAt: new Date() });
      await expect.poll(() => seen, { timeout: 5_000 }).toEqual([1, 2]);
    } finally {
      await runner.stop();
    }
  });
});
