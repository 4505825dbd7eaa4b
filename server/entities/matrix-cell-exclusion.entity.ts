import { Column, Entity, Index } from 'typeorm';
import { RecordedEntity } from './base-entities';

/** A matrix cell the editor left out of the roundup, with why; removing the row takes the cell back in. */
@Entity({ name: 'matrix_cell_exclusions' })
export class MatrixCellExclusionEntity extends RecordedEntity {
  @Index('ix_matrix_cell_exclusions_roundup')
  @Column({ type: 'int', unsigned: true, name: 'roundup_id' })
  roundupId: number;

  @Index('uq_matrix_cell_exclusions_cell', { unique: true })
  @Column({ type: 'int', unsigned: true, name: 'matrix_cell_id' })
  cellId: number;

  @Column({ type: 'text' })
  reason: string;

  @Column({ type: 'int', unsigned: true, name: 'excluded_by' })
  excludedBy: number;
}
