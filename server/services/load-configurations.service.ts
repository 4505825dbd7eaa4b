import { In, type DataSource, type EntityManager } from 'typeorm';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { invalid } from '../errors';
import { ArchivableNamedRecords } from '../lib/named-records';
import type { FieldChanges } from '../lib/field-changes';
import { loadConfigurationRoundupCounts, toLoadConfigurationDto } from '../mappers/load-configuration';
import { recordSharedPlanChange } from '../lib/roundup-audit';
import type {
  LoadConfiguration,
  ParsedCreateLoadConfigurationRequest,
  ParsedUpdateLoadConfigurationRequest,
} from '../../shared/schemas/load-configurations';
import type { CurrentUser } from '../../shared/schemas/auth';

export class LoadConfigurationsService extends ArchivableNamedRecords<LoadConfigurationEntity, LoadConfiguration> {
  constructor(dataSource: DataSource) {
    super(dataSource, {
      entity: LoadConfigurationEntity,
      subject: 'load_configuration',
      label: 'load configuration',
      toDto: toLoadConfigurationDto,
      roundupCounts: loadConfigurationRoundupCounts,
      fields: [
        'name',
        'cpuDescription',
        'settingsMode',
        'fixedClockMhz',
        'settingsNotes',
        'expectedPackagePowerW',
        'coreVoltageV',
        'soakMinutes',
      ],
      decimalScales: { expectedPackagePowerW: 1, coreVoltageV: 3 },
    });
  }

  create(actor: CurrentUser, input: ParsedCreateLoadConfigurationRequest): Promise<LoadConfiguration> {
    return this.createFromInput(actor, input, {
      fixedClockMhz: input.settingsMode === 'fixed' ? input.fixedClockMhz : null,
    });
  }

  /** Edits a configuration; roundups in planning or on the bench that use it get a history entry too. */
  update(actor: CurrentUser, id: number, input: ParsedUpdateLoadConfigurationRequest): Promise<LoadConfiguration> {
    return this.updateFromInput(
      actor,
      id,
      input,
      (manager, changes) => noteInRoundups(manager, actor, id, changes),
      (merged) => {
        if (merged.settingsMode === 'fixed' && !merged.fixedClockMhz) {
          throw invalid('A fixed configuration needs its clock in MHz.', {
            fixedClockMhz: 'A fixed configuration needs its clock in MHz.',
          });
        }
        if (merged.settingsMode === 'stock') merged.fixedClockMhz = null;
      },
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
