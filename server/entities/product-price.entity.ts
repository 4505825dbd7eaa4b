import { Column, Entity, Index } from 'typeorm';
import { RecordedEntity } from './base-entities';

/** One observed price of a product in a region; prices are history and are never edited in place. */
@Entity({ name: 'product_prices' })
@Index('ix_product_prices_latest', ['productId', 'region', 'observedOn', 'id'])
export class ProductPriceEntity extends RecordedEntity {
  @Column({ type: 'int', unsigned: true, name: 'product_id' })
  productId: number;

  @Column({ type: 'varchar', length: 8 })
  region: string;

  @Column({ type: 'char', length: 3 })
  currency: string;

  /** Integer minor units of `currency`. */
  @Column({ type: 'int', unsigned: true, name: 'amount_minor' })
  amountMinor: number;

  @Column({ type: 'date', name: 'observed_on', utc: true })
  observedOn: string;

  @Column({ type: 'varchar', length: 200 })
  source: string;

  @Column({ type: 'int', unsigned: true, name: 'recorded_by', nullable: true })
  recordedBy: number | null;
}
