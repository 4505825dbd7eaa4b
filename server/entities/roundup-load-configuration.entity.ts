import { Column, Entity, PrimaryColumn } from 'typeorm';

/** The ordered list of load configurations in a roundup's test plan. */
@Entity({ name: 'roundup_load_configurations' })
export class RoundupLoadConfigurationEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'roundup_id' })
  roundupId: number;

  @PrimaryColumn({ type: 'int', unsigned: true, name: 'load_configuration_id' })
  loadConfigurationId: number;

  @Column({ type: 'smallint', unsigned: true })
  position: number;
}
