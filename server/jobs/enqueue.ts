import type { EntityManager } from 'typeorm';

export interface NewJob {
  kind: string;
  payload: unknown;
  runAt: Date;
  /** At most one job per key: enqueueing the same key again keeps (or, with `replace`, re-times) the first. */
  uniqueKey?: string;
  maxAttempts?: number;
}

/**
 * Adds a job inside the caller's transaction, so the work is queued exactly when the change that needs it commits.
 * With a unique key already queued, `keep` leaves the existing job alone; `replace` gives it the new payload and
 * time and makes it pending again (rescheduling).
 */
export async function enqueueJob(
  manager: EntityManager,
  job: NewJob,
  onDuplicate: 'keep' | 'replace' = 'keep',
): Promise<void> {
  const update =
    onDuplicate === 'replace'
      ? `payload = VALUES(payload), run_at = VALUES(run_at), state = 'pending', attempts = 0, last_error = NULL,
         locked_by = NULL, locked_at = NULL, finished_at = NULL, max_attempts = VALUES(max_attempts)`
      : 'id = id';
  await manager.query(
    `INSERT INTO jobs (kind, unique_key, payload, run_at, max_attempts) VALUES (?, ?, ?, ?, ?)
     ON DUPLICATE KEY UPDATE ${update}`,
    [job.kind, job.uniqueKey ?? null, JSON.stringify(job.payload ?? null), job.runAt, job.maxAttempts ?? 10],
  );
}

/** Cancels the pending job with this key (a running one finishes; its handler re-checks what it acts on). */
export async function cancelJob(manager: EntityManager, uniqueKey: string, now: Date): Promise<void> {
  await manager.query(
    `UPDATE jobs SET state = 'cancelled', finished_at = ? WHERE unique_key = ? AND state = 'pending'`,
    [now, uniqueKey],
  );
}
