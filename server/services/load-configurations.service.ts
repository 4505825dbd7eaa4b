import { In, type DataSource, type EntityManager } from 'typeorm';
import type { z } from 'zod';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { invalid } from '../errors';
import { ArchivableNamedRecords } from '../lib/named-records';
import { fieldChanges, type FieldChanges } from '../lib/field-changes';
import { loadConfigurationRoundupCounts, toLoadConfigurationDto } from '../mappers/load-configuration';
import { recordSharedPlanChange } from '../lib/roundup-audit';
import type {
  createLoadConfigurationRequestSchema,
  LoadConfiguration,
  updateLoadConfigurationRequestSchema,
} from '../../shared/schemas/load-configurations';
import type { CurrentUser } from '../../shared/schemas/auth';

type CreateInput = z.output<typeof createLoadConfigurationRequestSchema>;
type UpdateInput = z.output<typeof updateLoadConfigurationRequestSchema>;

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

export class LoadConfigurationsService extends ArchivableNamedRecords<LoadConfigurationEntity, LoadConfiguration> {
  constructor(dataSource: DataSource) {
    super(
      dataSource,
      LoadConfigurationEntity,
      'load_configuration',
      'load configuration',
      toLoadConfigurationDto,
      loadConfigurationRoundupCounts,
    );
  }

  create(actor: CurrentUser, input: CreateInput): Promise<LoadConfiguration> {
    const row = {
      ...toColumns(input),
      fixedClockMhz: input.settingsMode === 'fixed' ? input.fixedClockMhz : null,
      createdBy: actor.id,
    };
    return this.createNamed(actor, row, input.name);
  }

  /** Edits a configuration; roundups in planning or on the bench that use it get a history entry too. */
  update(actor: CurrentUser, id: number, input: UpdateInput): Promise<LoadConfiguration> {
    return this.updateNamed(
      actor,
      id,
      input.archived,
      (before) => {
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
        return { patch, changes };
      },
      (manager, changes) => noteInRoundups(manager, actor, id, changes),
    );
  }
}

/** The history entry of each roundup that uses an edited configuration (those in planning or on the bench). */
async function noteInRoundups(manager: EntityManager, actor: CurrentUser, id: number, changes: FieldChanges) {
  const links = await manager.getRepository(RoundupLoadConfigurationEntity).findBy({ loadConfigurationId: id });
  if (links.length === 0) return;
  const usedBy = { id: In(links.map((l) => l.roundupId)) };
  await recordSharedPlanChange(manager, actor, usedBy, 'roundup.load_configuration_edited', {
    loadConfigurationId: id,
    changes,
  });
}
