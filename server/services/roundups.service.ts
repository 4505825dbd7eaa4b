import { In, type DataSource, type EntityManager } from 'typeorm';
import type { z } from 'zod';
import { AuditEntryEntity } from '../entities/audit-entry.entity';
import { BenchProfileEntity } from '../entities/bench-profile.entity';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { AppError, conflict, invalid } from '../errors';
import { benchProfileRoundupCounts, toBenchProfileDto } from '../mappers/bench-profile';
import { loadConfigurationRoundupCounts, toLoadConfigurationDto } from '../mappers/load-configuration';
import { loadPeople, personOrNull } from '../mappers/people';
import { recordPlanChange } from '../lib/roundup-audit';
import { assertPlanEditable, assertRoundupExists, findRoundup, lockRoundup } from '../lib/roundup-access';
import { bandOf, roundupSummaries } from '../mappers/roundup';
import { roundupEntries } from '../mappers/roundup-entry';
import { cellStateLabels, statesWithWork } from '../../shared/domain/planning/matrix-cell-states';
import {
  nextRoundupState,
  planEditableStates,
  roundupStateLabels,
  roundupTransitionProblems,
  type RoundupState,
} from '../../shared/domain/planning/roundup-states';
import type { CurrentUser } from '../../shared/schemas/auth';
import type {
  ParsedCreateRoundupRequest,
  ParsedRoundupListQuery,
  ParsedUpdateRoundupRequest,
  RoundupDetail,
  roundupHistorySchema,
  RoundupSummary,
} from '../../shared/schemas/roundups';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';

type History = z.infer<typeof roundupHistorySchema>;

/** Checks that the profile exists and may be chosen (archived profiles stay only where already chosen). */
async function checkBenchProfile(manager: EntityManager, id: number | null, current: number | null) {
  if (id == null) return;
  const profile = await manager.getRepository(BenchProfileEntity).findOneBy({ id });
  if (!profile)
    throw invalid('That bench profile does not exist.', { benchProfileId: 'That bench profile does not exist.' });
  if (profile.archivedAt && id !== current) {
    throw invalid('That bench profile is archived.', {
      benchProfileId: 'That bench profile is archived; restore it first.',
    });
  }
}

async function checkLoadConfigurations(manager: EntityManager, ids: number[], current: number[]) {
  if (ids.length === 0) return;
  const configs = await manager.getRepository(LoadConfigurationEntity).findBy({ id: In(ids) });
  const found = new Map(configs.map((c) => [c.id, c]));
  for (const [index, id] of ids.entries()) {
    const config = found.get(id);
    if (!config) {
      throw invalid('A load configuration in the list does not exist.', {
        [`loadConfigurationIds.${index}`]: 'This configuration does not exist.',
      });
    }
    if (config.archivedAt && !current.includes(id)) {
      throw invalid(`“${config.name}” is archived.`, {
        [`loadConfigurationIds.${index}`]: 'This configuration is archived; restore it first.',
      });
    }
  }
}

export class RoundupsService {
  constructor(private readonly dataSource: DataSource) {}

  async list(query: ParsedRoundupListQuery): Promise<RoundupSummary[]> {
    const manager = this.dataSource.manager;
    const roundups = await manager
      .getRepository(RoundupEntity)
      .find({ where: query.state ? { state: query.state } : {}, order: { createdAt: 'DESC', id: 'DESC' } });
    return roundupSummaries(manager, roundups, new Date());
  }

  async get(id: number, manager: EntityManager = this.dataSource.manager): Promise<RoundupDetail> {
    const now = new Date();
    const roundup = await findRoundup(manager, id);
    const [summary] = await roundupSummaries(manager, [roundup], now);
    const profile = roundup.benchProfileId
      ? await manager.getRepository(BenchProfileEntity).findOneBy({ id: roundup.benchProfileId })
      : null;
    const links = await manager
      .getRepository(RoundupLoadConfigurationEntity)
      .find({ where: { roundupId: id }, order: { position: 'ASC' } });
    const configs = links.length
      ? await manager.getRepository(LoadConfigurationEntity).findBy({ id: In(links.map((l) => l.loadConfigurationId)) })
      : [];
    const configById = new Map(configs.map((c) => [c.id, c]));
    const counts = await loadConfigurationRoundupCounts(
      manager,
      configs.map((c) => c.id),
    );
    const loadConfigurations = links.map((link) => {
      const config = configById.get(link.loadConfigurationId) as LoadConfigurationEntity;
      return toLoadConfigurationDto(config, counts.get(config.id) ?? 0);
    });
    const entries = await roundupEntries(manager, roundup, now);

    const planWarnings: string[] = [];
    if (profile) {
      for (const config of loadConfigurations) {
        if (config.soakMinutes < profile.requiredSoakMinutes) {
          planWarnings.push(
            `“${config.name}” soaks ${config.soakMinutes} min, shorter than the ${profile.requiredSoakMinutes} min the bench profile requires.`,
          );
        }
      }
      if (profile.archivedAt) planWarnings.push(`The bench profile “${profile.name}” is archived.`);
    }
    for (const config of loadConfigurations) {
      if (config.archived) planWarnings.push(`The load configuration “${config.name}” is archived.`);
    }
    const archivedProducts = entries.filter((e) => e.product.archived);
    for (const entry of archivedProducts)
      planWarnings.push(`${productDisplayName(entry.product)} is archived in the catalog.`);

    const next = nextRoundupState(roundup.state);
    const problems = next ? roundupTransitionProblems(await this.facts(manager, roundup), next) : [];
    return {
      ...summary,
      benchProfile: profile
        ? toBenchProfileDto(profile, (await benchProfileRoundupCounts(manager, [profile.id])).get(profile.id) ?? 0)
        : null,
      loadConfigurations,
      entries,
      planWarnings,
      nextState: next ? { to: next, allowed: problems.length === 0, problems } : null,
      planEditable: planEditableStates.includes(roundup.state),
    };
  }

  async create(actor: CurrentUser, input: ParsedCreateRoundupRequest): Promise<RoundupDetail> {
    return this.dataSource.transaction(async (manager) => {
      await checkBenchProfile(manager, input.benchProfileId, null);
      await checkLoadConfigurations(manager, input.loadConfigurationIds, []);
      const { identifiers } = await manager.getRepository(RoundupEntity).insert({
        title: input.title,
        category: input.category,
        platform: input.platform,
        state: 'planning',
        priceMinMinor: input.priceBand.minMinor,
        priceMaxMinor: input.priceBand.maxMinor,
        currency: input.priceBand.currency,
        region: input.priceBand.region,
        targetPublishDate: input.targetPublishDate,
        timeZone: input.timeZone,
        benchProfileId: input.benchProfileId,
        createdBy: actor.id,
        stateChangedAt: new Date(),
      });
      const id = Number(identifiers[0].id);
      if (input.loadConfigurationIds.length > 0) {
        await manager.getRepository(RoundupLoadConfigurationEntity).insert(
          input.loadConfigurationIds.map((loadConfigurationId, position) => ({
            roundupId: id,
            loadConfigurationId,
            position,
          })),
        );
      }
      await recordPlanChange(manager, actor, id, 'roundup.created', {
        title: input.title,
        platform: input.platform,
        priceBand: input.priceBand,
        targetPublishDate: input.targetPublishDate,
        timeZone: input.timeZone,
        benchProfileId: input.benchProfileId,
        loadConfigurationIds: input.loadConfigurationIds,
      });
      return this.get(id, manager);
    });
  }

  /**
   * Edits the header. The title and target date may change in any state; the band, platform, category, time
   * zone and bench profile are the plan and change only while the plan is editable.
   */
  async update(actor: CurrentUser, id: number, input: ParsedUpdateRoundupRequest): Promise<RoundupDetail> {
    return this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, id);
      const current = {
        title: roundup.title,
        category: roundup.category,
        platform: roundup.platform,
        priceBand: bandOf(roundup),
        targetPublishDate: roundup.targetPublishDate,
        timeZone: roundup.timeZone,
        benchProfileId: roundup.benchProfileId,
      };
      const changes: Record<string, { from: unknown; to: unknown }> = {};
      for (const key of Object.keys(current) as (keyof typeof current)[]) {
        const value = input[key];
        if (value === undefined) continue;
        if (JSON.stringify(value) !== JSON.stringify(current[key])) changes[key] = { from: current[key], to: value };
      }
      if (Object.keys(changes).length === 0) return this.get(id, manager);
      const planKeys = Object.keys(changes).filter((k) => k !== 'title' && k !== 'targetPublishDate');
      if (planKeys.length > 0) assertPlanEditable(roundup);
      if (changes.benchProfileId)
        await checkBenchProfile(manager, input.benchProfileId ?? null, roundup.benchProfileId);
      const patch: Partial<RoundupEntity> = {};
      if (input.title !== undefined) patch.title = input.title;
      if (input.category !== undefined) patch.category = input.category;
      if (input.platform !== undefined) patch.platform = input.platform;
      if (input.targetPublishDate !== undefined) patch.targetPublishDate = input.targetPublishDate;
      if (input.timeZone !== undefined) patch.timeZone = input.timeZone;
      if (input.benchProfileId !== undefined) patch.benchProfileId = input.benchProfileId;
      if (input.priceBand) {
        patch.priceMinMinor = input.priceBand.minMinor;
        patch.priceMaxMinor = input.priceBand.maxMinor;
        patch.currency = input.priceBand.currency;
        patch.region = input.priceBand.region;
      }
      await manager.getRepository(RoundupEntity).update({ id }, patch);
      await recordPlanChange(manager, actor, id, 'roundup.updated', changes);
      return this.get(id, manager);
    });
  }

  /**
   * Replaces the ordered list of load configurations. New configurations get a not-started cell per tested
   * entry; a removed configuration takes its cells with it, which is refused once any of them has work.
   */
  async setLoadConfigurations(actor: CurrentUser, id: number, ids: number[]): Promise<RoundupDetail> {
    return this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, id);
      assertPlanEditable(roundup);
      const linkRepo = manager.getRepository(RoundupLoadConfigurationEntity);
      const links = await linkRepo.find({ where: { roundupId: id }, order: { position: 'ASC' } });
      const before = links.map((l) => l.loadConfigurationId);
      await checkLoadConfigurations(manager, ids, before);
      const removed = before.filter((c) => !ids.includes(c));
      const added = ids.filter((c) => !before.includes(c));
      const cells = manager.getRepository(MatrixCellEntity);
      if (removed.length > 0) {
        const busy = await cells.find({
          where: { roundupId: id, loadConfigurationId: In(removed), state: In([...statesWithWork]) },
          lock: { mode: 'pessimistic_write' },
        });
        if (busy.length > 0) {
          const config = await manager
            .getRepository(LoadConfigurationEntity)
            .findOneBy({ id: busy[0].loadConfigurationId });
          throw conflict(
            'configuration_has_work',
            `“${config?.name}” cannot leave the plan: ${busy.length} of its cells are ${[...new Set(busy.map((c) => cellStateLabels[c.state].toLowerCase()))].join(' or ')}.`,
          );
        }
        await cells.delete({ roundupId: id, loadConfigurationId: In(removed) });
      }
      await linkRepo.delete({ roundupId: id });
      if (ids.length > 0) {
        await linkRepo.insert(
          ids.map((loadConfigurationId, position) => ({ roundupId: id, loadConfigurationId, position })),
        );
      }
      if (added.length > 0) {
        const entries = await manager.getRepository(RoundupEntryEntity).findBy({ roundupId: id, kind: 'tested' });
        const now = new Date();
        const rows = entries.flatMap((entry) =>
          added.map((loadConfigurationId) => ({
            roundupId: id,
            entryId: entry.id,
            loadConfigurationId,
            state: 'not-started' as const,
            stateChangedAt: now,
          })),
        );
        if (rows.length > 0) await cells.insert(rows);
      }
      if (JSON.stringify(before) !== JSON.stringify(ids)) {
        await recordPlanChange(manager, actor, id, 'roundup.load_configurations_set', {
          from: before,
          to: ids,
          added,
          removed,
        });
      }
      return this.get(id, manager);
    });
  }

  async changeState(actor: CurrentUser, id: number, to: RoundupState): Promise<RoundupDetail> {
    return this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, id);
      if (roundup.state === to) return this.get(id, manager);
      const problems = roundupTransitionProblems(await this.facts(manager, roundup), to);
      if (problems.length > 0) {
        throw new AppError(
          'state_change_blocked',
          422,
          `The roundup cannot move to ${roundupStateLabels[to]}: ${problems.join(' ')}`,
          {
            to: problems.join(' '),
          },
        );
      }
      await manager.getRepository(RoundupEntity).update({ id }, { state: to, stateChangedAt: new Date() });
      await recordPlanChange(manager, actor, id, 'roundup.state_changed', { from: roundup.state, to });
      return this.get(id, manager);
    });
  }

  async history(id: number): Promise<History['entries']> {
    const manager = this.dataSource.manager;
    await assertRoundupExists(manager, id);
    const entries = await manager.getRepository(AuditEntryEntity).find({
      where: { subjectType: 'roundup', subjectId: String(id) },
      order: { createdAt: 'DESC', id: 'DESC' },
      take: 500,
    });
    const people = await loadPeople(
      manager,
      entries.map((e) => e.actorId),
    );
    return entries.map((entry) => ({
      id: String(entry.id),
      action: entry.action,
      actor: personOrNull(people, entry.actorId),
      at: entry.createdAt.toISOString(),
      details: entry.details,
    }));
  }

  private async facts(manager: EntityManager, roundup: RoundupEntity) {
    const [configs, tested, cells, accepted] = await Promise.all([
      manager.getRepository(RoundupLoadConfigurationEntity).countBy({ roundupId: roundup.id }),
      manager.getRepository(RoundupEntryEntity).countBy({ roundupId: roundup.id, kind: 'tested' }),
      manager.getRepository(MatrixCellEntity).countBy({ roundupId: roundup.id }),
      manager.getRepository(MatrixCellEntity).countBy({ roundupId: roundup.id, state: 'accepted' }),
    ]);
    return {
      state: roundup.state,
      hasBenchProfile: roundup.benchProfileId != null,
      loadConfigurationCount: configs,
      testedEntryCount: tested,
      cellCount: cells,
      acceptedCellCount: accepted,
    };
  }
}
