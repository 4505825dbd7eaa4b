import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/** A reusable CPU + settings + load; each one a roundup uses becomes a matrix column. */
@Entity({ name: 'load_configurations' })
export class LoadConfigurationEntity {
  @PrimaryGeneratedColumn({ type: 'int', unsigned: true })
  id: number;

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

  @Column({ type: 'datetime', precision: 3, name: 'archived_at', nullable: true })
  archivedAt: Date | null;

  @Column({ type: 'int', unsigned: true, name: 'created_by', nullable: true })
  createdBy: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt: Date;
}
