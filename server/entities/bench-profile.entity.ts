import type { ColumnMapping } from '../../shared/schemas/analysis';
import { Column, Entity } from 'typeorm';
import { VarcharColumn, DecimalColumn } from './columns';
import { NamedArchivableEntity } from './base-entities';

/** A reusable description of the test system and the conditions a roundup is measured under. */
@Entity({ name: 'bench_profiles' })
export class BenchProfileEntity extends NamedArchivableEntity {
  @VarcharColumn(300, { name: 'case_and_fans' })
  caseAndFans: string;

  @VarcharColumn(200)
  cooler: string;

  @VarcharColumn(200)
  psu: string;

  @VarcharColumn(300)
  memory: string;

  /** °C, DECIMAL(4,1). */
  @DecimalColumn(4, 1, 'room_temp_target_c')
  roomTempTargetC: string;

  /** ± °C, DECIMAL(3,1). */
  @DecimalColumn(3, 1, 'room_temp_tolerance_c')
  roomTempToleranceC: string;

  @VarcharColumn(120, { name: 'probe_type' })
  probeType: string;

  @VarcharColumn(300, { name: 'probe_placement' })
  probePlacement: string;

  @Column({ type: 'smallint', unsigned: true, name: 'required_soak_minutes' })
  requiredSoakMinutes: number;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  /** The logger column mapping last confirmed on this profile; the next upload starts from it. */
  @Column({ type: 'json', name: 'log_mapping', nullable: true })
  logMapping: ColumnMapping | null;
}
