import type { ColumnMapping } from '../../shared/schemas/analysis';
import { Column, Entity } from 'typeorm';
import { ArchivableEntity } from './base-entities';

/** A reusable description of the test system and the conditions a roundup is measured under. */
@Entity({ name: 'bench_profiles' })
export class BenchProfileEntity extends ArchivableEntity {
  @Column({ type: 'varchar', length: 120, unique: true })
  name: string;

  @Column({ type: 'varchar', length: 300, name: 'case_and_fans' })
  caseAndFans: string;

  @Column({ type: 'varchar', length: 200 })
  cooler: string;

  @Column({ type: 'varchar', length: 200 })
  psu: string;

  @Column({ type: 'varchar', length: 300 })
  memory: string;

  /** °C, DECIMAL(4,1). */
  @Column({ type: 'decimal', precision: 4, scale: 1, name: 'room_temp_target_c' })
  roomTempTargetC: string;

  /** ± °C, DECIMAL(3,1). */
  @Column({ type: 'decimal', precision: 3, scale: 1, name: 'room_temp_tolerance_c' })
  roomTempToleranceC: string;

  @Column({ type: 'varchar', length: 120, name: 'probe_type' })
  probeType: string;

  @Column({ type: 'varchar', length: 300, name: 'probe_placement' })
  probePlacement: string;

  @Column({ type: 'smallint', unsigned: true, name: 'required_soak_minutes' })
  requiredSoakMinutes: number;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  /** The logger column mapping last confirmed on this profile; the next upload starts from it. */
  @Column({ type: 'json', name: 'log_mapping', nullable: true })
  logMapping: ColumnMapping | null;
}
