import { Column, Entity } from 'typeorm';
import { ArchivableEntity } from './base-entities';

/** A reusable CPU + settings + load; each one a roundup uses becomes a matrix column. */
@Entity({ name: 'load_configurations' })
export class LoadConfigurationEntity extends ArchivableEntity {
  @Column({ type: 'varchar', length: 120, unique: true })
  name: string;

  @Column({ type: 'varchar', length: 200, name: 'cpu_description' })
  cpuDescription: string;

  @Column({ type: 'varchar', length: 16, name: 'settings_mode' })
  settingsMode: string;

  @Column({ type: 'smallint', unsigned: true, name: 'fixed_clock_mhz', nullable: true })
  fixedClockMhz: number | null;

  @Column({ type: 'varchar', length: 500, name: 'settings_notes', nullable: true })
  settingsNotes: string | null;

  /** W, DECIMAL(5,1). */
  @Column({ type: 'decimal', precision: 5, scale: 1, name: 'expected_package_power_w' })
  expectedPackagePowerW: string;

  /** V, DECIMAL(4,3). */
  @Column({ type: 'decimal', precision: 4, scale: 3, name: 'core_voltage_v' })
  coreVoltageV: string;

  @Column({ type: 'smallint', unsigned: true, name: 'soak_minutes' })
  soakMinutes: number;
}
