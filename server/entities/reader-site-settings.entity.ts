import { Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';
import { VarcharColumn } from './columns';

/** The outlet's reader-site settings: one row (id 1), absent until an editor saves them. */
@Entity({ name: 'reader_site_settings' })
export class ReaderSiteSettingsEntity {
  @PrimaryColumn({ type: 'tinyint', unsigned: true })
  id: number;

  @VarcharColumn(120, { name: 'outlet_name' })
  outletName: string;

  /** Printed with every roundup's open data. */
  @VarcharColumn(300, { name: 'open_data_licence' })
  openDataLicence: string;

  @UpdateDateColumn({ type: 'datetime', precision: 3, name: 'updated_at' })
  updatedAt: Date;
}
