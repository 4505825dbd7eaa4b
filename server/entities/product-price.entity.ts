import { Column, Entity, Index } from 'typeorm';
import { IntColumn, OptionalIntColumn, DayColumn, VarcharColumn } from './columns';
import { RecordedEntity } from './base-entities';

/** One observed price of a product in a region; prices are history and are never edited in place. */
@Entity({ name: 'product_prices' })
@Index('ix_product_prices_latest', ['productId', 'region', 'observedOn', 'id'])
export class ProductPriceEntity extends RecordedEntity {
  @IntColumn('product_id')
  productId: number;

  @VarcharColumn(8)
  region: string;

  @Column({ type: 'char', length: 3 })
  currency: string;

  /** Integer minor units of `currency`. */
  @IntColumn('amount_minor')
  amountMinor: number;

  @DayColumn('observed_on')
  observedOn: string;

  @VarcharColumn(200)
  source: string;

  @OptionalIntColumn('recorded_by')
  recordedBy: number | null;
}
