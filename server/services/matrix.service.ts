import { In, type DataSource } from 'typeorm';
import { BenchBookingCellEntity } from '../entities/bench-booking-cell.entity';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { UserEntity } from '../entities/user.entity';
import { AppError, conflict, forbidden, invalid, notFound } from '../errors';
import { recordPlanChange } from '../lib/roundup-audit';
import { cellDtoFacts, emptyProgress, progressByRoundup, toMatrixCellDto } from '../mappers/matrix-cell';
import { productBriefs } from '../mappers/product-fields';
import { assertPlanEditable, findRoundup, lockRoundup } from '../lib/roundup-access';
import { cellBookingAt } from './benches.service';
import { TestRunsService } from './test-runs.service';
import { StaffMailService } from './staff-mail.service';
import {
  cellStateLabels,
  decideCellTransition,
  stateAfterAssignment,
  type CellAction,
} from '../../shared/domain/planning/matrix-cell-states';
import { roundupStateLabels } from '../../shared/domain/planning/roundup-states';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { MatrixCell, ParsedAssignCellsRequest, RoundupMatrix } from '../../shared/schemas/matrix';
import type { ProductBrief } from '../../shared/schemas/catalog';
import type { PersonRef } from '../../shared/schemas/planning-fields';

/** The test matrix: products × load configurations, assignments and cell moves. */
export class MatrixService {
  constructor(private readonly dataSource: DataSource) {}

  async matrix(roundupId: number, user: CurrentUser): Promise<RoundupMatrix> {
    const manager = this.dataSource.manager;
    const now = new Date();
    const roundup = await findRoundup(manager, roundupId);
    const links = await manager
      .getRepository(RoundupLoadConfigurationEntity)
      .find({ where: { roundupId }, order: { position: 'ASC' } });
    const configs = links.length
      ? await manager.getRepository(LoadConfigurationEntity).find({
          where: { id: In(links.map((l) => l.loadConfigurationId)) },
          select: { id: true, name: true },
        })
      : [];
    const nameById = new Map(configs.map((c) => [c.id, c.name]));
    const entries = await manager
      .getRepository(RoundupEntryEntity)
      .find({ where: { roundupId }, order: { position: 'ASC', id: 'ASC' } });
    const products = await productBriefs(
      manager,
      entries.map((e) => e.productId),
    );
    const cells = await manager.getRepository(MatrixCellEntity).findBy({ roundupId });
    const { people, runFacts } = await cellDtoFacts(manager, cells);
    const cellAt = new Map(cells.map((c) => [`${c.entryId}:${c.loadConfigurationId}`, c]));
    return {
      roundupId,
      roundupState: roundup.state,
      timeZone: roundup.timeZone,
      columns: links.map((link) => ({
        loadConfigurationId: link.loadConfigurationId,
        name: nameById.get(link.loadConfigurationId) ?? '',
        position: link.position,
      })),
      rows: entries.map((entry) => ({
        entryId: entry.id,
        kind: entry.kind,
        product: products.get(entry.productId) as ProductBrief,
        cells:
          entry.kind === 'reference'
            ? []
            : links
                .map((link) => cellAt.get(`${entry.id}:${link.loadConfigurationId}`))
                .filter((cell): cell is MatrixCellEntity => cell !== undefined)
                .map((cell) => toMatrixCellDto(cell, roundup.timeZone, people, user, now, runFacts)),
      })),
      progress: (await progressByRoundup(manager, [roundupId])).get(roundupId) ?? emptyProgress(),
    };
  }

  async testers(): Promise<PersonRef[]> {
    const testers = await this.dataSource.getRepository(UserEntity).find({
      where: { role: 'tester', active: true },
      order: { displayName: 'ASC' },
      select: { id: true, displayName: true },
    });
    return testers.map((t) => ({ id: t.id, displayName: t.displayName }));
  }

  /**
   * Assigns cells and whole rows to one tester with a due date. Named cells must be assignable (not started,
   * assigned or needs retest) or nothing changes; whole rows take only their assignable cells.
   */
  async assign(actor: CurrentUser, roundupId: number, input: ParsedAssignCellsRequest): Promise<MatrixCell[]> {
    return this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId);
      assertPlanEditable(roundup);
      const tester = await manager.getRepository(UserEntity).findOneBy({ id: input.testerId });
      if (!tester || tester.role !== 'tester' || !tester.active) {
        throw invalid('Choose an active bench tester.', { testerId: 'Choose an active bench tester.' });
      }
      const repo = manager.getRepository(MatrixCellEntity);
      const named = input.cellIds.length
        ? await repo.find({ where: { id: In(input.cellIds) }, lock: { mode: 'pessimistic_write' } })
        : [];
      const foreign = input.cellIds.filter((id) => !named.some((c) => c.id === id && c.roundupId === roundupId));
      if (foreign.length > 0) {
        throw invalid('Some cells are not in this roundup.', {
          cellIds: `Cells ${foreign.join(', ')} are not in this roundup.`,
        });
      }
      const blocked = named.filter((c) => stateAfterAssignment(c.state) === null);
      if (blocked.length > 0) {
        throw new AppError(
          'cell_not_assignable',
          422,
          `Only cells that are not started, assigned or need a retest can be assigned; ${blocked.length} chosen cell(s) are ${[
            ...new Set(blocked.map((c) => cellStateLabels[c.state].toLowerCase())),
          ].join(' or ')}.`,
          { cellIds: blocked.map((c) => c.id).join(', ') },
        );
      }
      let rowCells: MatrixCellEntity[] = [];
      if (input.entryIds.length > 0) {
        const rows = await manager.getRepository(RoundupEntryEntity).findBy({ id: In(input.entryIds), roundupId });
        const missing = input.entryIds.filter((id) => !rows.some((r) => r.id === id));
        if (missing.length > 0)
          throw invalid('Some rows are not in this roundup.', {
            entryIds: `Rows ${missing.join(', ')} are not in this roundup.`,
          });
        const reference = rows.filter((r) => r.kind === 'reference');
        if (reference.length > 0) {
          throw invalid('Reference entries are not re-tested, so they have no cells to assign.', {
            entryIds: `Rows ${reference.map((r) => r.id).join(', ')} are reference entries.`,
          });
        }
        rowCells = (
          await repo.find({ where: { entryId: In(input.entryIds) }, lock: { mode: 'pessimistic_write' } })
        ).filter((c) => stateAfterAssignment(c.state) !== null);
      }
      const targets = new Map<number, MatrixCellEntity>();
      for (const cell of [...named, ...rowCells]) targets.set(cell.id, cell);
      const now = new Date();
      for (const cell of targets.values()) {
        const next = stateAfterAssignment(cell.state) as MatrixCellEntity['state'];
        if (cell.testerId !== null && cell.testerId !== input.testerId) {
          // The previous tester's bookings no longer cover this cell.
          await manager.getRepository(BenchBookingCellEntity).delete({ cellId: cell.id });
        }
        await repo.update(
          { id: cell.id },
          {
            testerId: input.testerId,
            dueDate: input.dueDate,
            state: next,
            assignedAt: now,
            ...(next !== cell.state ? { stateChangedAt: now } : {}),
          },
        );
      }
      const cellIds = [...targets.keys()];
      if (cellIds.length > 0) {
        await recordPlanChange(manager, actor, roundupId, 'roundup.cells_assigned', {
          cellIds,
          testerId: input.testerId,
          tester: tester.displayName,
          dueDate: input.dueDate,
        });
        await StaffMailService.cellsAssigned(manager, {
          testerId: input.testerId,
          roundupId,
          cellIds,
          dueDate: input.dueDate ?? null,
          at: now,
        });
      }
      const updated = cellIds.length ? await repo.findBy({ id: In(cellIds) }) : [];
      const { people, runFacts } = await cellDtoFacts(manager, updated);
      return updated.map((cell) => toMatrixCellDto(cell, roundup.timeZone, people, actor, now, runFacts));
    });
  }

  /**
   * Moves one cell by the rules in shared/domain/planning/matrix-cell-states.ts: 403 when the user may not
   * make the move (wrong role, someone else's cell), 422 when the cell is not in a state the move starts from.
   */
  async transition(
    actor: CurrentUser,
    roundupId: number,
    cellId: number,
    action: CellAction,
    note?: string,
    overrideReason?: string,
  ): Promise<MatrixCell> {
    return this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId, 'pessimistic_read');
      const repo = manager.getRepository(MatrixCellEntity);
      const cell = await repo.findOne({ where: { id: cellId, roundupId }, lock: { mode: 'pessimistic_write' } });
      if (!cell) throw notFound('That cell');
      const verdict = decideCellTransition({ state: cell.state, testerId: cell.testerId }, action, actor);
      if (!verdict.ok) {
        if (verdict.reason === 'wrong-state') throw new AppError('invalid_transition', 422, verdict.message);
        throw forbidden(verdict.message);
      }
      if (action === 'start' && roundup.state !== 'on-the-bench') {
        throw new AppError(
          'roundup_not_on_bench',
          422,
          `The roundup is ${roundupStateLabels[roundup.state]}; runs start once it is On the bench.`,
        );
      }
      if (!['planning', 'on-the-bench'].includes(roundup.state)) {
        throw new AppError(
          'plan_locked',
          422,
          `The roundup is ${roundupStateLabels[roundup.state]}; its matrix is closed.`,
        );
      }
      if (action === 'record') await TestRunsService.assertCellHasRun(manager, cellId);
      const now = new Date();
      // A run belongs in bench time booked for it; starting outside every booking of the cell is warned about and
      // needs a reason, which the plan's history keeps.
      let outsideBooking: { overrideReason: string } | null = null;
      if (action === 'start') {
        const { covering, next } = await cellBookingAt(manager, cellId, now);
        if (!covering) {
          if (!overrideReason) {
            throw conflict(
              'start_outside_booking',
              `No booking of this cell covers now${next ? `; its next one is ${next}` : ''}. The bench may be booked by someone else: book a slot, or start anyway and say why.`,
              { overrideReason: 'Say why the run starts outside its bookings.' },
            );
          }
          outsideBooking = { overrideReason };
        }
      }
      const patch: Partial<MatrixCellEntity> = { state: verdict.to, stateChangedAt: now };
      if (note !== undefined && note !== '') patch.note = note;
      if (action === 'unassign') {
        patch.testerId = null;
        patch.dueDate = null;
        patch.assignedAt = null;
        await manager.getRepository(BenchBookingCellEntity).delete({ cellId });
      }
      await repo.update({ id: cellId }, patch);
      await recordPlanChange(manager, actor, roundupId, 'roundup.cell_moved', {
        cellId,
        action,
        from: cell.state,
        to: verdict.to,
        ...(note ? { note } : {}),
        ...(outsideBooking ? { startedOutsideBooking: true, overrideReason: outsideBooking.overrideReason } : {}),
      });
      if (action === 'send-back') {
        await StaffMailService.cellSentBack(manager, { cellId, testerId: cell.testerId, roundupId, note, at: now });
      }
      const updated = await repo.findOneByOrFail({ id: cellId });
      const { people, runFacts } = await cellDtoFacts(manager, [updated]);
      return toMatrixCellDto(updated, roundup.timeZone, people, actor, now, runFacts);
    });
  }
}
