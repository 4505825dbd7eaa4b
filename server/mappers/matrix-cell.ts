// Matrix cells and matrix progress as the API sends them.
import type { EntityManager } from 'typeorm';
import type { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { loadPeople, personOrNull } from './people';
import { availableCellActions, cellStates, type CellState } from '../../shared/domain/planning/matrix-cell-states';
import { hasDateEnded } from '../../shared/domain/planning/loan-overdue';
import { qaFlagLabels } from '../../shared/domain/analysis/qa-flag-labels';
import type { QaFlagCode } from '../../shared/schemas/analysis';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { MatrixCell, MatrixProgress } from '../../shared/schemas/matrix';
import type { PersonRef } from '../../shared/schemas/planning-fields';

/** Cells that are done (or waiting for the editor) are never overdue. */
const finishedStates = new Set<CellState>(['recorded', 'accepted']);

/** What a cell's test runs say on the planning matrix. */
export interface CellRunFacts {
  runCount: number;
  /** QA flags of the run the results matrix shows (the run of record, else the newest run), in words. */
  qaFlags: string[];
}

/**
 * Submitted test runs per cell and the QA flags of the run shown for it, for the cells given (cells without runs are
 * absent). The flags are those of that run's newest analysis, as on the results matrix.
 */
export async function runFactsByCell(manager: EntityManager, cellIds: number[]): Promise<Map<number, CellRunFacts>> {
  const facts = new Map<number, CellRunFacts>();
  if (cellIds.length === 0) return facts;
  const cellList = cellIds.map(() => '?').join(',');
  const rows: { matrix_cell_id: number; n: string; shown_run_id: number }[] = await manager.query(
    `SELECT run.matrix_cell_id, COUNT(*) AS n, COALESCE(MAX(cell.run_of_record_id), MAX(run.id)) AS shown_run_id
     FROM test_runs run JOIN matrix_cells cell ON cell.id = run.matrix_cell_id
     WHERE run.matrix_cell_id IN (${cellList}) GROUP BY run.matrix_cell_id`,
    cellIds,
  );
  const shownRunIds = rows.map((row) => Number(row.shown_run_id));
  const flagRows: { test_run_id: number; flag_codes: string }[] = shownRunIds.length
    ? await manager.query(
        `SELECT test_run_id, flag_codes FROM run_analyses WHERE id IN (
           SELECT MAX(id) FROM run_analyses WHERE test_run_id IN (${shownRunIds.map(() => '?').join(',')})
           GROUP BY test_run_id)`,
        shownRunIds,
      )
    : [];
  const flagsByRun = new Map(flagRows.map((row) => [Number(row.test_run_id), row.flag_codes]));
  for (const row of rows) {
    const codes = (flagsByRun.get(Number(row.shown_run_id)) ?? '').split(',').filter(Boolean);
    facts.set(Number(row.matrix_cell_id), {
      runCount: Number(row.n),
      qaFlags: codes.map((code) => qaFlagLabels[code as QaFlagCode] ?? code),
    });
  }
  return facts;
}

/** What the DTOs of the given cells need besides the cells: their testers and their runs' facts, read once. */
export async function cellDtoFacts(manager: EntityManager, cells: readonly MatrixCellEntity[]) {
  const people = await loadPeople(
    manager,
    cells.map((c) => c.testerId),
  );
  const runFacts = await runFactsByCell(
    manager,
    cells.map((c) => c.id),
  );
  return { people, runFacts };
}

export function toMatrixCellDto(
  cell: MatrixCellEntity,
  timeZone: string,
  people: Map<number, PersonRef>,
  user: CurrentUser,
  now: Date,
  runFacts: Map<number, CellRunFacts>,
): MatrixCell {
  const { runCount, qaFlags } = runFacts.get(cell.id) ?? { runCount: 0, qaFlags: [] };
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
    qaFlags,
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
