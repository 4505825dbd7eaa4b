import type { DataSource } from 'typeorm';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { MatrixCellExclusionEntity } from '../entities/matrix-cell-exclusion.entity';
import { AppError, conflict, notFound } from '../errors';
import { loadEditorialFacts } from '../lib/editorial-facts';
import { lockRoundup } from '../lib/roundup-access';
import { recordPlanChange } from '../lib/roundup-audit';
import type { ChartsService } from './charts.service';
import type { RoundupsService } from './roundups.service';
import { may, reviewRequesters } from '../../shared/access/roles';
import { cellStateLabels } from '../../shared/domain/planning/matrix-cell-states';
import { roundupStateLabels, type RoundupState } from '../../shared/domain/planning/roundup-states';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { Readiness, ReadinessBlocker } from '../../shared/schemas/readiness';
import type { RoundupDetail } from '../../shared/schemas/roundups';

/**
 * What the write-ups say still blocks a roundup (sections not approved), each item linking to where it is fixed.
 * The write-up sections plug in here; without them nothing is reported from that side.
 */
export type SectionsBlocking = (roundupId: number) => Promise<ReadinessBlocker[]>;

const roundupLink = (id: number) => `/roundups/${id}`;
const matrixLink = (id: number) => `/roundups/${id}?tab=matrix`;
const chartsLink = (id: number, key: string) => `/roundups/${id}/charts#${key}`;
const readinessLink = (id: number) => `/roundups/${id}/readiness`;
const verdictLink = (id: number, entryId: number) => `/roundups/${id}/verdicts#verdict-${entryId}`;

/** States that come before review: the roundup must be sent to review before it can be ready to schedule. */
const beforeReview: readonly RoundupState[] = ['planning', 'on-the-bench', 'writing'];
/** States in which the editor may still leave cells out of the roundup or take them back in. */
const exclusionStates: readonly RoundupState[] = ['on-the-bench', 'writing', 'in-review'];

/**
 * "Ready to schedule", computed: every write-up section approved, every chart approved and not stale, every tested
 * product with the editor's verdict label, every matrix cell accepted with a run of record or left out with a reason —
 * and the roundup in review. Also the editor's cell
 * exclusions and the move from Writing to In review.
 */
export class ReadinessService {
  private sectionsBlocking: SectionsBlocking = async () => [];

  constructor(
    private readonly dataSource: DataSource,
    private readonly charts: ChartsService,
    private readonly roundups: RoundupsService,
  ) {}

  /** Plugs in the write-ups' own check of their sections. */
  useSectionsBlocking(check: SectionsBlocking) {
    this.sectionsBlocking = check;
  }

  /**
   * Whether the roundup is ready to schedule, and if not, exactly what blocks it, each with the screen where it is
   * fixed. The publishing side calls this before In review → Scheduled.
   */
  async readiness(roundupId: number, viewer?: CurrentUser): Promise<Readiness> {
    const manager = this.dataSource.manager;
    const facts = await loadEditorialFacts(manager, roundupId);
    const { roundup } = facts;
    const blocking: ReadinessBlocker[] = [];

    if (beforeReview.includes(roundup.state)) {
      blocking.push({
        kind: 'state',
        label:
          roundup.state === 'writing'
            ? 'The roundup is still Writing: send it to review.'
            : `The roundup is ${roundupStateLabels[roundup.state]}: finish testing and writing first.`,
        link: roundup.state === 'writing' ? readinessLink(roundupId) : roundupLink(roundupId),
      });
    }

    blocking.push(...(await this.sectionsBlocking(roundupId)));

    for (const state of await this.charts.states(manager, facts)) {
      if (state.status === 'not-approved') {
        blocking.push({
          kind: 'chart',
          label: `Chart “${state.data.title}” is not approved.`,
          link: chartsLink(roundupId, state.key),
        });
      } else if (state.status === 'stale') {
        blocking.push({
          kind: 'chart',
          label: `Chart “${state.data.title}” is stale and needs re-approval: ${state.changes.join(' ')}`,
          link: chartsLink(roundupId, state.key),
        });
      }
    }

    // Every tested product carries the editor's verdict label when it is published (our choice: the label is part of
    // what the reader is promised). A product whose every cell is left out has no results to judge and needs none.
    for (const { entry, name } of facts.tested) {
      const ownCells = facts.cells.filter((c) => c.entryId === entry.id);
      const allLeftOut = ownCells.length > 0 && ownCells.every((c) => facts.exclusions.has(c.id));
      if (!facts.verdicts.has(entry.id) && !allLeftOut) {
        blocking.push({
          kind: 'verdict',
          label: `${name} has no verdict label yet: choose one on the verdicts page.`,
          link: verdictLink(roundupId, entry.id),
        });
      }
    }

    for (const { entry, name } of facts.tested) {
      for (const configuration of facts.configurations) {
        const cell = facts.cells.find((c) => c.entryId === entry.id && c.loadConfigurationId === configuration.id);
        if (!cell || facts.exclusions.has(cell.id)) continue;
        const where = `${name} × “${configuration.name}”`;
        if (cell.state !== 'accepted') {
          blocking.push({
            kind: 'cell',
            label: `${where} is ${cellStateLabels[cell.state]}: accept a run or leave the cell out with a reason.`,
            link: matrixLink(roundupId),
            cellId: cell.id,
          });
        } else if (cell.runOfRecordId === null) {
          blocking.push({
            kind: 'cell',
            label: `${where} is accepted but has no run of record: choose the run that stands for it.`,
            link: matrixLink(roundupId),
            cellId: cell.id,
          });
        }
      }
    }
    const excludedCells = facts.cells.flatMap((cell) => {
      const exclusion = facts.exclusions.get(cell.id);
      if (!exclusion) return [];
      const product = facts.tested.find((t) => t.entry.id === cell.entryId)?.name ?? 'A product';
      const configuration = facts.configurations.find((c) => c.id === cell.loadConfigurationId)?.name ?? '';
      return [{ cellId: cell.id, label: `${product} × “${configuration}”`, reason: exclusion.reason }];
    });
    return {
      roundupId,
      ready: blocking.length === 0,
      blocking,
      excludedCells,
      state: roundup.state,
      canRequestReview: roundup.state === 'writing' && (viewer ? may(viewer.role, reviewRequesters) : false),
    };
  }

  /** Leaves a cell out of the roundup with a reason (reversible); readiness then no longer waits for it. */
  async excludeCell(actor: CurrentUser, roundupId: number, cellId: number, reason: string): Promise<Readiness> {
    await this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId);
      this.assertExclusionState(roundup.state);
      const cell = await manager.getRepository(MatrixCellEntity).findOneBy({ id: cellId, roundupId });
      if (!cell) throw notFound('That matrix cell in this roundup');
      const repo = manager.getRepository(MatrixCellExclusionEntity);
      const existing = await repo.findOneBy({ cellId });
      if (existing) await repo.update({ id: existing.id }, { reason, excludedBy: actor.id });
      else await repo.insert({ roundupId, cellId, reason, excludedBy: actor.id });
      await recordPlanChange(manager, actor, roundupId, 'matrix.cell_excluded', {
        cellId,
        entryId: cell.entryId,
        loadConfigurationId: cell.loadConfigurationId,
        reason,
        previousReason: existing?.reason ?? null,
      });
    });
    return this.readiness(roundupId, actor);
  }

  /** Takes an excluded cell back into the roundup. */
  async includeCell(actor: CurrentUser, roundupId: number, cellId: number): Promise<Readiness> {
    await this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId);
      this.assertExclusionState(roundup.state);
      const repo = manager.getRepository(MatrixCellExclusionEntity);
      const existing = await repo.findOneBy({ cellId, roundupId });
      if (!existing) throw notFound('An exclusion of that cell');
      await repo.delete({ id: existing.id });
      await recordPlanChange(manager, actor, roundupId, 'matrix.cell_included', { cellId, reason: existing.reason });
    });
    return this.readiness(roundupId, actor);
  }

  /** Writing → In review, by a writer or an editor. */
  async requestReview(actor: CurrentUser, roundupId: number): Promise<RoundupDetail> {
    const roundup = await this.roundups.get(roundupId);
    if (roundup.state !== 'writing') {
      throw conflict(
        'not_writing',
        roundup.state === 'in-review'
          ? 'The roundup is already in review.'
          : `Only a roundup that is Writing can go to review; this one is ${roundupStateLabels[roundup.state]}.`,
      );
    }
    return this.roundups.changeState(actor, roundupId, 'in-review');
  }

  private assertExclusionState(state: RoundupState) {
    if (!exclusionStates.includes(state)) {
      throw new AppError(
        'exclusions_locked',
        422,
        `The roundup is ${roundupStateLabels[state]}: cells are left out or taken back only while it is On the bench, Writing or In review.`,
      );
    }
  }
}
