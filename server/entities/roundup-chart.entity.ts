import { Column, Entity, Index } from 'typeorm';
import { EditedEntity } from './base-entities';
import type { ChartSettings } from '../../shared/domain/editorial/chart-data';

/**
 * A chart of a roundup, by key (`configuration-12`, `product-34`, `price-scatter`): the editor's settings, and once
 * approved the frozen snapshot of exactly what was approved (settings, data, palette), its hash and its PNG.
 */
@Entity({ name: 'roundup_charts' })
@Index('uq_roundup_charts_key', ['roundupId', 'chartKey'], { unique: true })
export class RoundupChartEntity extends EditedEntity {
  @Column({ type: 'int', unsigned: true, name: 'roundup_id' })
  roundupId: number;

  @Column({ type: 'varchar', length: 40, name: 'chart_key' })
  chartKey: string;

  @Column({ type: 'json' })
  settings: ChartSettings;

  @Column({ type: 'json', name: 'approved_snapshot', nullable: true })
  approvedSnapshot: Record<string, unknown> | null;

  @Column({ type: 'char', length: 64, name: 'approved_hash', nullable: true })
  approvedHash: string | null;

  @Column({ type: 'int', unsigned: true, name: 'approved_by', nullable: true })
  approvedBy: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'approved_at', nullable: true })
  approvedAt: Date | null;

  @Column({ type: 'int', unsigned: true, name: 'image_file_id', nullable: true })
  imageFileId: number | null;
}
