import { Column, Entity, Index } from 'typeorm';
import { RecordedEntity } from './base-entities';

/**
 * One analysis of a run, never edited: re-analysing with another mapping or rubric adds a row. The headline figures
 * are columns (DECIMAL, arriving as strings) so the matrix and charts need not read the JSON.
 */
@Entity({ name: 'run_analyses' })
@Index('ix_run_analyses_run', ['testRunId', 'id'])
export class RunAnalysisEntity extends RecordedEntity {
  @Column({ type: 'int', unsigned: true, name: 'test_run_id' })
  testRunId: number;

  @Column({ type: 'varchar', length: 40, name: 'engine_version' })
  engineVersion: string;

  /** The mapping, options and rubric the engine was given. */
  @Column({ type: 'json' })
  parameters: Record<string, unknown>;

  /** The engine's whole answer (figures, flags, verdict, chart series summary). */
  @Column({ type: 'json' })
  result: Record<string, unknown>;

  @Column({ type: 'varchar', length: 30, nullable: true })
  verdict: string | null;

  @Column({ type: 'decimal', precision: 6, scale: 2, name: 'peak_c', nullable: true })
  peakC: string | null;

  @Column({ type: 'decimal', precision: 5, scale: 2, name: 'ambient_c', nullable: true })
  ambientC: string | null;

  @Column({ type: 'decimal', precision: 6, scale: 2, name: 'delta_over_ambient_c', nullable: true })
  deltaOverAmbientC: string | null;

  @Column({ type: 'decimal', precision: 6, scale: 2, name: 'normalised_peak_c', nullable: true })
  normalisedPeakC: string | null;

  @Column({ type: 'decimal', precision: 9, scale: 1, name: 'throttled_s', nullable: true })
  throttledS: string | null;

  /** QA flag codes, comma-separated, for filtering; the flags themselves are in `result`. */
  @Column({ type: 'varchar', length: 500, name: 'flag_codes', default: '' })
  flagCodes: string;

  @Column({ type: 'int', unsigned: true, name: 'created_by' })
  createdBy: number;
}
