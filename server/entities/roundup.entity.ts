import type { VerdictRubric } from '../../shared/schemas/analysis';
import { Column, Entity } from 'typeorm';
import { EditedEntity } from './base-entities';
import type { RoundupState } from '../../shared/domain/planning/roundup-states';
import { roundupStates } from '../../shared/domain/planning/roundup-states';

/** A roundup: its plan (band, dates, bench profile) and its state, which later issues extend. */
@Entity({ name: 'roundups' })
export class RoundupEntity extends EditedEntity {
  @Column({ type: 'varchar', length: 200 })
  title: string;

  @Column({ type: 'varchar', length: 32 })
  category: string;

  @Column({ type: 'varchar', length: 80 })
  platform: string;

  @Column({ type: 'enum', enum: roundupStates, default: 'planning' })
  state: RoundupState;

  @Column({ type: 'int', unsigned: true, name: 'price_min_minor' })
  priceMinMinor: number;

  @Column({ type: 'int', unsigned: true, name: 'price_max_minor' })
  priceMaxMinor: number;

  @Column({ type: 'char', length: 3 })
  currency: string;

  @Column({ type: 'varchar', length: 8 })
  region: string;

  @Column({ type: 'date', name: 'target_publish_date', nullable: true, utc: true })
  targetPublishDate: string | null;

  /** IANA zone of the outlet for this roundup: due and return-by dates end at its midnight. */
  @Column({ type: 'varchar', length: 64, name: 'time_zone' })
  timeZone: string;

  /** The verdict rubric an editor set for this roundup; null means the engine's defaults. */
  @Column({ type: 'json', name: 'verdict_rubric', nullable: true })
  verdictRubric: VerdictRubric | null;

  /** Whether the published open data offers the raw logger files of the runs of record (the editor's choice). */
  @Column({ type: 'boolean', name: 'open_data_raw_files', default: false })
  openDataRawFiles: boolean;

  @Column({ type: 'int', unsigned: true, name: 'bench_profile_id', nullable: true })
  benchProfileId: number | null;

  @Column({ type: 'int', unsigned: true, name: 'created_by', nullable: true })
  createdBy: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'state_changed_at' })
  stateChangedAt: Date;
}
