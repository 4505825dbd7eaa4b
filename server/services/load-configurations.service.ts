import { In, type DataSource, type EntityManager } from 'typeorm';
import type { z } from 'zod';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { conflict, invalid, notFound } from '../errors';
import { recordAudit } from './audit.service';
import { archivedWhere, refusingDuplicates } from '../lib/database-errors';
import { fieldChanges } from '../lib/field-changes';
import { loadConfigurationRoundupCounts, toLoadConfigurationDto } from '../mappers/load-configuration';
import { recordSharedPlanChange } from '../lib/roundup-audit';
import type {
  createLoadConfigurationRequestSchema,
  LoadConfiguration,
  loadConfigurationListQuerySchema,
  updateLoadConfigurationRequestSchema,
} from '../../shared/schemas/load-configurations';
import type { CurrentUser } from '../../shared/schemas/auth';

type CreateInput = z.output<typeof createLoadConfigurationRequestSchema>;
type UpdateInput = z.output<typeof updateLoadConfigurationRequestSchema>;
type ListQuery = z.output<typeof loadConfigurationListQuerySchema>;

const nameTaken = () =>
  conflict('name_taken', 'Another load configuration already has this name.', {
    name: 'Another load configuration already has this name.',
  });

const fieldNames = [
  'name',
  'cpuDescription',
  'settingsMode',
  'fixedClockMhz',
  'settingsNotes',
  'expectedPackagePowerW',
  'coreVoltageV',
  'soakMinutes',
] as const;

function toColumns(input: Partial<CreateInput>): Partial<LoadConfigurationEntity> {
  const columns: Partial<LoadConfigurationEntity> = {};
  for (const key of fieldNames) {
    const value = input[key];
    if (value === undefined) continue;
    if (key === 'expectedPackagePowerW') columns.expectedPackagePowerW = (value as number).toFixed(1);
    else if (key === 'coreVoltageV') columns.coreVoltageV = (value as number).toFixed(3);
    else (columns as Record<string, unknown>)[key] = value;
  }
  return columns;
}

export class LoadConfigurationsService {
  constructor(private readonly dataSource: DataSource) {}

  async list(query: ListQuery): Promise<LoadConfiguration[]> {
    const manager = this.dataSource.manager;
    const where = archivedWhere(query.archived);
    const configs = await manager.getRepository(LoadConfigurationEntity).find({ where, order: { name: 'ASC' } });
    const counts = await loadConfigurationRoundupCounts(
      manager,
      configs.map((c) => c.id),
    );
    return configs.map((c) => toLoadConfigurationDto(c, counts.get(c.id) ?? 0));
  }

  async get(id: number, manager: EntityManager = this.dataSource.manager): Promise<LoadConfiguration> {
    const config = await manager.getRepository(LoadConfigurationEntity).findOneBy({ id });
    if (!config) throw notFound('That load configuration');
    return toLoadConfigurationDto(config, (await loadConfigurationRoundupCounts(manager, [id])).get(id) ?? 0);
  }

  create(actor: CurrentUser, input: CreateInput): Promise<LoadConfiguration> {
    return refusingDuplicates(
      () =>
        this.dataSource.transaction(async (manager) => {
          const { identifiers } = await manager.getRepository(LoadConfigurationEntity).insert({
            ...toColumns(input),
            fixedClockMhz: input.settingsMode === 'fixed' ? input.fixedClockMhz : null,
            createdBy: actor.id,
          });
          const id = Number(identifiers[0].id);
          await recordAudit(manager, {
            actorId: actor.id,
            action: 'load_configuration.created',
            subjectType: 'load_configuration',
            subjectId: id,
            details: { name: input.name },
          });
          return this.get(id, manager);
        }),
      nameTaken,
    );
  }

  /** Edits a configuration; roundups in planning or on the bench that use it get a history entry too. */
  update(actor: CurrentUser, id: number, input: UpdateInput): Promise<LoadConfiguration> {
    return refusingDuplicates(
      () =>
        this.dataSource.transaction(async (manager) => {
          const repo = manager.getRepository(LoadConfigurationEntity);
          const config = await repo.findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
          if (!config) throw notFound('That load configuration');
          const before = toLoadConfigurationDto(config, 0);
          const merged = { ...before, ...Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)) };
          if (merged.settingsMode === 'fixed' && !merged.fixedClockMhz) {
            throw invalid('A fixed configuration needs its clock in MHz.', {
              fixedClockMhz: 'A fixed configuration needs its clock in MHz.',
            });
          }
          if (merged.settingsMode === 'stock') merged.fixedClockMhz = null;
          const changes = fieldChanges(before, merged, fieldNames);
          const patch = toColumns(
            Object.fromEntries(
              Object.keys(changes).map((k) => [k, merged[k as keyof typeof merged]]),
            ) as Partial<CreateInput>,
          );
          if (input.archived !== undefined && input.archived !== before.archived) {
            patch.archivedAt = input.archived ? new Date() : null;
            changes.archived = { from: before.archived, to: input.archived };
          }
          if (Object.keys(patch).length > 0) {
            await repo.update({ id }, patch);
            await recordAudit(manager, {
              actorId: actor.id,
              action: 'load_configuration.updated',
              subjectType: 'load_configuration',
              subjectId: id,
              details: changes,
            });
            const links = await manager
              .getRepository(RoundupLoadConfigurationEntity)
              .findBy({ loadConfigurationId: id });
            if (links.length > 0) {
              const usedBy = { id: In(links.map((l) => l.roundupId)) };
              await recordSharedPlanChange(manager, actor, usedBy, 'roundup.load_configuration_edited', {
                loadConfigurationId: id,
                changes,
              });
            }
          }
          return this.get(id, manager);
        }),
      nameTaken,
    );
  }
}
