import { Column, Entity, Index } from 'typeorm';
import { IntColumn, VarcharColumn, DecimalColumn } from './columns';
import { RecordedEntity } from './base-entities';

/**
 * One analysis of a run, never edited: re-analysing with another mapping or rubric adds a row. The headline figures
 * are columns (DECIMAL, arriving as strings) so the matrix and charts need not read the JSON.
 */
@Entity({ name: 'run_analyses' })
@Index('ix_run_analyses_run', ['testRunId', 'id'])
export class RunAnalysisEntity extends RecordedEntity {
  @IntColumn('test_run_id')
  testRunId: number;

  @VarcharColumn(40, { name: 'engine_version' })
  engineVersion: string;

  /** The mapping, options and rubric the engine was given. */
  @Column({ type: 'json' })
  parameters: Record<string, unknown>;

  /** The engine's whole answer (figures, flags, verdict, chart series summary). */
  @Column({ type: 'json' })
  result: Record<string, unknown>;

  @VarcharColumn(30, { nullable: true })
  verdict: string | null;

  @DecimalColumn(6, 2, 'peak_c', { nullable: true })
  peakC: string | null;

  @DecimalColumn(5, 2, 'ambient_c', { nullable: true })
  ambientC: string | null;

  @DecimalColumn(6, 2, 'delta_over_ambient_c', { nullable: true })
  deltaOverAmbientC: string | null;

  @DecimalColumn(6, 2, 'normalised_peak_c', { nullable: true })
  normalisedPeakC: string | null;

  @DecimalColumn(9, 1, 'throttled_s', { nullable: true })
  throttledS: string | null;

  /** QA flag codes, comma-separated, for filtering; the flags themselves are in `result`. */
  @VarcharColumn(500, { name: 'flag_codes', default: '' })
  flagCodes: string;

  @IntColumn('created_by')
  createdBy: number;
}
