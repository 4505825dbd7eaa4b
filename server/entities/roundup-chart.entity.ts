import { Column, Entity, Index } from 'typeorm';
import { IntColumn, OptionalIntColumn, OptionalInstantColumn, VarcharColumn } from './columns';
import { EditedEntity } from './base-entities';
import type { ChartSettings } from '../../shared/domain/editorial/chart-data';

/**
 * A chart of a roundup, by key (`configuration-12`, `product-34`, `price-scatter`): the editor's settings, and once
 * approved the frozen snapshot of exactly what was approved (settings, data, palette), its hash and its PNG.
 */
@Entity({ name: 'roundup_charts' })
@Index('uq_roundup_charts_key', ['roundupId', 'chartKey'], { unique: true })
export class RoundupChartEntity extends EditedEntity {
  @IntColumn('roundup_id')
  roundupId: number;

  @VarcharColumn(40, { name: 'chart_key' })
  chartKey: string;

  @Column({ type: 'json' })
  settings: ChartSettings;

  @Column({ type: 'json', name: 'approved_snapshot', nullable: true })
  approvedSnapshot: Record<string, unknown> | null;

  @Column({ type: 'char', length: 64, name: 'approved_hash', nullable: true })
  approvedHash: string | null;

  @OptionalIntColumn('approved_by')
  approvedBy: number | null;

  @OptionalInstantColumn('approved_at')
  approvedAt: Date | null;

  @OptionalIntColumn('image_file_id')
  imageFileId: number | null;
}
