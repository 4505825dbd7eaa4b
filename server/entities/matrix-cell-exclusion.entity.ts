import { Column, Entity, Index } from 'typeorm';
import { IntColumn } from './columns';
import { RecordedEntity } from './base-entities';

/** A matrix cell the editor left out of the roundup, with why; removing the row takes the cell back in. */
@Entity({ name: 'matrix_cell_exclusions' })
export class MatrixCellExclusionEntity extends RecordedEntity {
  @Index('ix_matrix_cell_exclusions_roundup')
  @IntColumn('roundup_id')
  roundupId: number;

  @Index('uq_matrix_cell_exclusions_cell', { unique: true })
  @IntColumn('matrix_cell_id')
  cellId: number;

  @Column({ type: 'text' })
  reason: string;

  @IntColumn('excluded_by')
  excludedBy: number;
}
