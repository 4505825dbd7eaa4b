import type { DataSource } from 'typeorm';
import { BenchProfileEntity } from '../entities/bench-profile.entity';
import { ArchivableNamedRecords } from '../lib/named-records';
import { benchProfileRoundupCounts, toBenchProfileDto } from '../mappers/bench-profile';
import { recordSharedPlanChange } from '../lib/roundup-audit';
import type {
  BenchProfile,
  ParsedCreateBenchProfileRequest,
  ParsedUpdateBenchProfileRequest,
} from '../../shared/schemas/bench-profiles';
import type { CurrentUser } from '../../shared/schemas/auth';

export class BenchProfilesService extends ArchivableNamedRecords<BenchProfileEntity, BenchProfile> {
  constructor(dataSource: DataSource) {
    super(dataSource, {
      entity: BenchProfileEntity,
      subject: 'bench_profile',
      label: 'bench profile',
      toDto: toBenchProfileDto,
      roundupCounts: benchProfileRoundupCounts,
      fields: [
        'name',
        'caseAndFans',
        'cooler',
        'psu',
        'memory',
        'roomTempTargetC',
        'roomTempToleranceC',
        'probeType',
        'probePlacement',
        'requiredSoakMinutes',
        'notes',
      ],
      decimalScales: { roomTempTargetC: 1, roomTempToleranceC: 1 },
    });
  }

  create(actor: CurrentUser, input: ParsedCreateBenchProfileRequest): Promise<BenchProfile> {
    return this.createFromInput(actor, input);
  }

  /**
   * Edits a profile. The profile is part of the plan of every roundup that uses it, so each such roundup still
   * in planning or on the bench gets a history entry too.
   */
  update(actor: CurrentUser, id: number, input: ParsedUpdateBenchProfileRequest): Promise<BenchProfile> {
    return this.updateFromInput(actor, id, input, (manager, changes) =>
      recordSharedPlanChange(manager, actor, { benchProfileId: id }, 'roundup.bench_profile_edited', {
        benchProfileId: id,
        changes,
      }),
    );
  }
}
