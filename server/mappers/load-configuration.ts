import type { EntityManager } from 'typeorm';
import type { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { decimalToNumber } from './dto-values';
import { countsById } from '../lib/counts-by-id';
import type { LoadConfiguration, LoadSettingsMode } from '../../shared/schemas/load-configurations';

export function toLoadConfigurationDto(config: LoadConfigurationEntity, roundupCount: number): LoadConfiguration {
  return {
    id: config.id,
    name: config.name,
    cpuDescription: config.cpuDescription,
    settingsMode: config.settingsMode as LoadSettingsMode,
    fixedClockMhz: config.fixedClockMhz,
    settingsNotes: config.settingsNotes,
    expectedPackagePowerW: decimalToNumber(config.expectedPackagePowerW),
    coreVoltageV: decimalToNumber(config.coreVoltageV),
    soakMinutes: config.soakMinutes,
    archived: config.archivedAt != null,
    roundupCount,
    createdAt: config.createdAt.toISOString(),
    updatedAt: config.updatedAt.toISOString(),
  };
}

/** How many roundups test under each load configuration. */
export function loadConfigurationRoundupCounts(manager: EntityManager, ids: number[]): Promise<Map<number, number>> {
  return countsById(
    manager,
    (inList) =>
      `SELECT load_configuration_id AS id, COUNT(*) AS n FROM roundup_load_configurations
       WHERE load_configuration_id IN (${inList}) GROUP BY load_configuration_id`,
    ids,
  );
}
