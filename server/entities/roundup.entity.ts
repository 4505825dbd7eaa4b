import type { VerdictRubric } from '../../shared/schemas/analysis';
import { Column, Entity } from 'typeorm';
import { IntColumn, OptionalIntColumn, InstantColumn, OptionalDayColumn, VarcharColumn } from './columns';
import { EditedEntity } from './base-entities';
import type { RoundupState } from '../../shared/domain/planning/roundup-states';
import { roundupStates } from '../../shared/domain/planning/roundup-states';

/** A roundup: its plan (band, dates, bench profile) and its state, which later issues extend. */
@Entity({ name: 'roundups' })
export class RoundupEntity extends EditedEntity {
  @VarcharColumn(200)
  title: string;

  @VarcharColumn(32)
  category: string;

  @VarcharColumn(80)
  platform: string;

  @Column({ type: 'enum', enum: roundupStates, default: 'planning' })
  state: RoundupState;

  @IntColumn('price_min_minor')
  priceMinMinor: number;

  @IntColumn('price_max_minor')
  priceMaxMinor: number;

  @Column({ type: 'char', length: 3 })
  currency: string;

  @VarcharColumn(8)
  region: string;

  @OptionalDayColumn('target_publish_date')
  targetPublishDate: string | null;

  /** IANA zone of the outlet for this roundup: due and return-by dates end at its midnight. */
  @VarcharColumn(64, { name: 'time_zone' })
  timeZone: string;

  /** The verdict rubric an editor set for this roundup; null means the engine's defaults. */
  @Column({ type: 'json', name: 'verdict_rubric', nullable: true })
  verdictRubric: VerdictRubric | null;

  /** Whether the published open data offers the raw logger files of the runs of record (the editor's choice). */
  @Column({ type: 'boolean', name: 'open_data_raw_files', default: false })
  openDataRawFiles: boolean;

  @OptionalIntColumn('bench_profile_id')
  benchProfileId: number | null;

  @OptionalIntColumn('created_by')
  createdBy: number | null;

  @InstantColumn('state_changed_at')
  stateChangedAt: Date;
}
