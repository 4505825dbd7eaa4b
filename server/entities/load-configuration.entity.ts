import { Column, Entity } from 'typeorm';
import { VarcharColumn, DecimalColumn } from './columns';
import { NamedArchivableEntity } from './base-entities';

/** A reusable CPU + settings + load; each one a roundup uses becomes a matrix column. */
@Entity({ name: 'load_configurations' })
export class LoadConfigurationEntity extends NamedArchivableEntity {
  @VarcharColumn(200, { name: 'cpu_description' })
  cpuDescription: string;

  @VarcharColumn(16, { name: 'settings_mode' })
  settingsMode: string;

  @Column({ type: 'smallint', unsigned: true, name: 'fixed_clock_mhz', nullable: true })
  fixedClockMhz: number | null;

  @VarcharColumn(500, { name: 'settings_notes', nullable: true })
  settingsNotes: string | null;

  /** W, DECIMAL(5,1). */
  @DecimalColumn(5, 1, 'expected_package_power_w')
  expectedPackagePowerW: string;

  /** V, DECIMAL(4,3). */
  @DecimalColumn(4, 3, 'core_voltage_v')
  coreVoltageV: string;

  @Column({ type: 'smallint', unsigned: true, name: 'soak_minutes' })
  soakMinutes: number;
}
