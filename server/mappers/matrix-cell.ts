// Matrix cells and matrix progress as the API sends them.
import type { EntityManager } from 'typeorm';
import type { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { personOrNull } from './people';
import { availableCellActions, cellStates, type CellState } from '../../shared/domain/planning/matrix-cell-states';
import { hasDateEnded } from '../../shared/domain/planning/loan-overdue';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { MatrixCell, MatrixProgress } from '../../shared/schemas/matrix';
import type { PersonRef } from '../../shared/schemas/planning-fields';

/** Cells that are done (or waiting for the editor) are never overdue. */
const finishedStates = new Set<CellState>(['recorded', 'accepted']);

/** Submitted test runs per cell, for the cells given (cells without runs are absent). */
export async function runCountsByCell(manager: EntityManager, cellIds: number[]): Promise<Map<number, number>> {
  const counts = new Map<number, number>();
  if (cellIds.length === 0) return counts;
  const rows: { matrix_cell_id: number; n: string }[] = await manager.query(
    `SELECT matrix_cell_id, COUNT(*) AS n FROM test_runs
     WHERE matrix_cell_id IN (${cellIds.map(() => '?').join(',')}) GROUP BY matrix_cell_id`,
    cellIds,
  );
  for (const row of rows) counts.set(Number(row.matrix_cell_id), Number(row.n));
  return counts;
}

export function toMatrixCellDto(
  cell: MatrixCellEntity,
  timeZone: string,
  people: Map<number, PersonRef>,
  user: CurrentUser,
  now: Date,
  runCounts: Map<number, number>,
): MatrixCell {
  const runCount = runCounts.get(cell.id) ?? 0;
  // "Mark recorded" needs a submitted run: without one it is not offered (the server refuses it too).
  const actions = availableCellActions({ state: cell.state, testerId: cell.testerId }, user).filter(
    (action) => action !== 'record' || runCount > 0,
  );
  return {
    id: cell.id,
    roundupId: cell.roundupId,
    entryId: cell.entryId,
    loadConfigurationId: cell.loadConfigurationId,
    state: cell.state,
    tester: personOrNull(people, cell.testerId),
    dueDate: cell.dueDate,
    overdue: cell.dueDate != null && !finishedStates.has(cell.state) && hasDateEnded(cell.dueDate, timeZone, now),
    note: cell.note,
    stateChangedAt: cell.stateChangedAt.toISOString(),
    runCount,
    actions,
  };
}

export function emptyProgress(): MatrixProgress {
  return {
    cellCount: 0,
    acceptedCount: 0,
    percentAccepted: 0,
    unassignedCount: 0,
    countsByState: Object.fromEntries(cellStates.map((s) => [s, 0])) as MatrixProgress['countsByState'],
  };
}

/** Matrix progress per roundup: cells by state, accepted share, and cells nobody is assigned to. */
export async function progressByRoundup(
  manager: EntityManager,
  roundupIds: number[],
): Promise<Map<number, MatrixProgress>> {
  const progress = new Map<number, MatrixProgress>();
  for (const id of roundupIds) progress.set(id, emptyProgress());
  if (roundupIds.length === 0) return progress;
  const rows: { roundup_id: number; state: CellState; n: string }[] = await manager.query(
    `SELECT roundup_id, state, COUNT(*) AS n FROM matrix_cells
     WHERE roundup_id IN (${roundupIds.map(() => '?').join(',')}) GROUP BY roundup_id, state`,
    roundupIds,
  );
  for (const row of rows) {
    const p = progress.get(Number(row.roundup_id));
    if (!p) continue;
    const n = Number(row.n);
    p.countsByState[row.state] = n;
    p.cellCount += n;
  }
  for (const p of progress.values()) {
    p.acceptedCount = p.countsByState.accepted;
    p.unassignedCount = p.countsByState['not-started'];
    // Floor, so 100 % means every cell is accepted.
    p.percentAccepted = p.cellCount === 0 ? 0 : Math.floor((p.acceptedCount * 100) / p.cellCount);
  }
  return progress;
}
