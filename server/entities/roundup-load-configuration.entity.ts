import { Column, Entity } from 'typeorm';
import { KeyedByPair } from './base-entities';

/** The ordered list of load configurations in a roundup's test plan. */
@Entity({ name: 'roundup_load_configurations' })
export class RoundupLoadConfigurationEntity extends KeyedByPair(
  ['roundupId', 'roundup_id'],
  ['loadConfigurationId', 'load_configuration_id'],
) {
  @Column({ type: 'smallint', unsigned: true })
  position: number;
}
