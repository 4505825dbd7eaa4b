import { Column, Entity, Index } from 'typeorm';
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
  @Column({ type: 'int', unsigned: true, name: 'roundup_id' })
  roundupId: number;

  @Column({ type: 'int', unsigned: true, name: 'roundup_entry_id' })
  entryId: number;

  @Column({ type: 'int', unsigned: true, name: 'load_configuration_id' })
  loadConfigurationId: number;

  @Column({ type: 'enum', enum: cellStates, default: 'not-started' })
  state: CellState;

  @Column({ type: 'int', unsigned: true, name: 'tester_id', nullable: true })
  testerId: number | null;

  @Column({ type: 'date', name: 'due_date', nullable: true, utc: true })
  dueDate: string | null;

  @Column({ type: 'varchar', length: 500, nullable: true })
  note: string | null;

  /** The run the editor chose to stand for this cell in results and charts. */
  @Column({ type: 'int', unsigned: true, name: 'run_of_record_id', nullable: true })
  runOfRecordId: number | null;

  @Column({ type: 'datetime', precision: 3, name: 'assigned_at', nullable: true })
  assignedAt: Date | null;

  @Column({ type: 'datetime', precision: 3, name: 'state_changed_at' })
  stateChangedAt: Date;
}
