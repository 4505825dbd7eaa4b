import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

export const jobStates = ['pending', 'running', 'done', 'failed', 'cancelled'] as const;
export type JobState = (typeof jobStates)[number];

/** One piece of scheduled work (publish a roundup, send a mail batch…); see server/jobs/job-runner.ts. */
@Entity({ name: 'jobs' })
export class JobEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', unsigned: true })
  id: string;

  @Column({ type: 'varchar', length: 64 })
  kind: string;

  /** Work with the same key is enqueued once; null for work that may repeat. */
  @Column({ type: 'varchar', length: 191, name: 'unique_key', nullable: true })
  uniqueKey: string | null;

  @Column({ type: 'json' })
  payload: unknown;

  @Column({ type: 'datetime', precision: 3, name: 'run_at' })
  runAt: Date;

  @Column({ type: 'enum', enum: jobStates, default: 'pending' })
  state: JobState;

  @Column({ type: 'int', unsigned: true, default: 0 })
  attempts: number;

  @Column({ type: 'int', unsigned: true, name: 'max_attempts', default: 10 })
  maxAttempts: number;

  @Column({ type: 'text', name: 'last_error', nullable: true })
  lastError: string | null;

  @Column({ type: 'varchar', length: 100, name: 'locked_by', nullable: true })
  lockedBy: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'locked_at', nullable: true })
  lockedAt: Date | null;

  @Column({ type: 'datetime', precision: 3, name: 'finished_at', nullable: true })
  finishedAt: Date | null;

  @Column({ type: 'datetime', precision: 3, name: 'created_at', default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @Column({ type: 'datetime', precision: 3, name: 'updated_at', default: () => 'CURRENT_TIMESTAMP(3)' })
  updatedAt: Date;
}
