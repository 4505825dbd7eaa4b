import { Column, Entity, Index } from 'typeorm';
import {
  IntColumn,
  OptionalIntColumn,
  InstantColumn,
  OptionalInstantColumn,
  VarcharColumn,
  DecimalColumn,
} from './columns';
import { EditedEntity } from './base-entities';

export const runSources = ['logger', 'manual'] as const;
export const runReviewStates = ['pending', 'accepted', 'sent-back'] as const;

/** One test run on one matrix cell. Its analyses are rows of run_analyses; the newest is the current one. */
@Entity({ name: 'test_runs' })
@Index('ix_test_runs_cell', ['matrixCellId', 'submittedAt'])
export class TestRunEntity extends EditedEntity {
  @IntColumn('matrix_cell_id')
  matrixCellId: number;

  @Index('ix_test_runs_roundup')
  @IntColumn('roundup_id')
  roundupId: number;

  @Index('ix_test_runs_tester')
  @IntColumn('tester_id')
  testerId: number;

  @OptionalIntColumn('bench_id')
  benchId: number | null;

  @OptionalIntColumn('bench_booking_id')
  benchBookingId: number | null;

  @VarcharColumn(100, { name: 'firmware_version' })
  firmwareVersion: string;

  @InstantColumn('started_at')
  startedAt: Date;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @Column({ type: 'enum', enum: runSources })
  source: (typeof runSources)[number];

  @OptionalIntColumn('logger_file_id')
  loggerFileId: number | null;

  /** DECIMAL(5,1), arrives as a string. */
  @DecimalColumn(5, 1, 'manual_peak_c', { nullable: true })
  manualPeakC: string | null;

  /** DECIMAL(4,1), arrives as a string. */
  @DecimalColumn(4, 1, 'manual_ambient_c', { nullable: true })
  manualAmbientC: string | null;

  @VarcharColumn(500, { name: 'outside_booking_reason', nullable: true })
  outsideBookingReason: string | null;

  @Column({ type: 'enum', enum: runReviewStates, name: 'review_state', default: 'pending' })
  reviewState: (typeof runReviewStates)[number];

  @Column({ type: 'text', name: 'review_reason', nullable: true })
  reviewReason: string | null;

  @OptionalIntColumn('reviewed_by')
  reviewedBy: number | null;

  @OptionalInstantColumn('reviewed_at')
  reviewedAt: Date | null;

  @InstantColumn('submitted_at')
  submittedAt: Date;
}
