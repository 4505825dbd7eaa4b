import { Column, Entity, Index } from 'typeorm';
import { EditedEntity } from './base-entities';

export const runSources = ['logger', 'manual'] as const;
export const runReviewStates = ['pending', 'accepted', 'sent-back'] as const;

/** One test run on one matrix cell. Its analyses are rows of run_analyses; the newest is the current one. */
@Entity({ name: 'test_runs' })
@Index('ix_test_runs_cell', ['matrixCellId', 'submittedAt'])
export class TestRunEntity extends EditedEntity {
  @Column({ type: 'int', unsigned: true, name: 'matrix_cell_id' })
  matrixCellId: number;

  @Index('ix_test_runs_roundup')
  @Column({ type: 'int', unsigned: true, name: 'roundup_id' })
  roundupId: number;

  @Index('ix_test_runs_tester')
  @Column({ type: 'int', unsigned: true, name: 'tester_id' })
  testerId: number;

  @Column({ type: 'int', unsigned: true, name: 'bench_id', nullable: true })
  benchId: number | null;

  @Column({ type: 'int', unsigned: true, name: 'bench_booking_id', nullable: true })
  benchBookingId: number | null;

  @Column({ type: 'varchar', length: 100, name: 'firmware_version' })
  firmwareVersion: string;

  @Column({ type: 'datetime', precision: 3, name: 'started_at' })
  startedAt: Date;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @Column({ type: 'enum', enum: runSources })
  source: (typeof runSources)[number];

  @Column({ type: 'int', unsigned: true, name: 'logger_file_id', nullable: true })
  loggerFileId: number | null;

  /** DECIMAL(5,1), arrives as a string. */
  @Column({ type: 'decimal', precision: 5, scale: 1, name: 'manual_peak_c', nullable: true })
  manualPeakC: string | null;

  /** DECIMAL(4,1), arrives as a string. */
  @Column({ type: 'decimal', precision: 4, scale: 1, name: 'manual_ambient_c', nullable: true })
  manualAmbientC: string | null;

  @Column({ type: 'varchar', length: 500, name: 'outside_booking_reason', nullable: true })
  outsideBookingReason: string | null;

  @Column({ type: 'enum', enum: runReviewStates, name: 'review_state', default: 'pending' })
  reviewState: (typeof runReviewStates)[number];

  @Column({ type: 'text', name: 'review_reason', nullable: true })
  reviewReason: string | null;

  @Column({ type: 'int', unsigned: true, name: 'reviewed_by', nullable: true })
  reviewedBy: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'reviewed_at', nullable: true })
  reviewedAt: Date | null;

  @Column({ type: 'datetime', precision: 3, name: 'submitted_at' })
  submittedAt: Date;
}
