import { Column, Entity, Index } from 'typeorm';
import {
  IntColumn,
  OptionalIntColumn,
  InstantColumn,
  OptionalInstantColumn,
  OptionalDayColumn,
  VarcharColumn,
} from './columns';
import { EditedEntity } from './base-entities';
import type { CellState } from '../../shared/domain/planning/matrix-cell-states';
import { cellStates } from '../../shared/domain/planning/matrix-cell-states';

/**
 * One roundup entry × one load configuration: its state, tester and due date. Test runs reference this row;
 * the editor marks one of them the run of record.
 */
@Entity({ name: 'matrix_cells' })
@Index('uq_matrix_cells_entry_config', ['entryId', 'loadConfigurationId'], { unique: true })
@Index('ix_matrix_cells_tester_queue', ['testerId', 'state', 'dueDate'])
@Index('ix_matrix_cells_roundup_state', ['roundupId', 'state'])
export class MatrixCellEntity extends EditedEntity {
  @IntColumn('roundup_id')
  roundupId: number;

  @IntColumn('roundup_entry_id')
  entryId: number;

  @IntColumn('load_configuration_id')
  loadConfigurationId: number;

  @Column({ type: 'enum', enum: cellStates, default: 'not-started' })
  state: CellState;

  @OptionalIntColumn('tester_id')
  testerId: number | null;

  @OptionalDayColumn('due_date')
  dueDate: string | null;

  @VarcharColumn(500, { nullable: true })
  note: string | null;

  /** The run the editor chose to stand for this cell in results and charts. */
  @OptionalIntColumn('run_of_record_id')
  runOfRecordId: number | null;

  @OptionalInstantColumn('assigned_at')
  assignedAt: Date | null;

  @InstantColumn('state_changed_at')
  stateChangedAt: Date;
}
