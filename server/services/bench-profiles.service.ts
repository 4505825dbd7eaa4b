import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import { BenchProfileEntity } from '../entities/bench-profile.entity';
import { ArchivableNamedRecords } from '../lib/named-records';
import { fieldChanges } from '../lib/field-changes';
import { benchProfileRoundupCounts, toBenchProfileDto } from '../mappers/bench-profile';
import { recordSharedPlanChange } from '../lib/roundup-audit';
import type {
  BenchProfile,
  createBenchProfileRequestSchema,
  updateBenchProfileRequestSchema,
} from '../../shared/schemas/bench-profiles';
import type { CurrentUser } from '../../shared/schemas/auth';

type CreateInput = z.output<typeof createBenchProfileRequestSchema>;
type UpdateInput = z.output<typeof updateBenchProfileRequestSchema>;

const fieldNames = [
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
] as const;

export class BenchProfilesService extends ArchivableNamedRecords<BenchProfileEntity, BenchProfile> {
  constructor(dataSource: DataSource) {
    super(
      dataSource,
      BenchProfileEntity,
      'bench_profile',
      'bench profile',
      toBenchProfileDto,
      benchProfileRoundupCounts,
    );
  }

  create(actor: CurrentUser, input: CreateInput): Promise<BenchProfile> {
    const row = {
      ...input,
      roomTempTargetC: input.roomTempTargetC.toFixed(1),
      roomTempToleranceC: input.roomTempToleranceC.toFixed(1),
      createdBy: actor.id,
    };
    return this.createNamed(actor, row, input.name);
  }

  /**
   * Edits a profile. The profile is part of the plan of every roundup that uses it, so each such roundup still
   * in planning or on the bench gets a history entry too.
   */
  update(actor: CurrentUser, id: number, input: UpdateInput): Promise<BenchProfile> {
    return this.updateNamed(
      actor,
      id,
      input.archived,
      (before) => {
        const changes = fieldChanges(before, input, fieldNames);
        const patch: Partial<BenchProfileEntity> = {};
        for (const key of Object.keys(changes) as (typeof fieldNames)[number][]) {
          const value = input[key];
          (patch as Record<string, unknown>)[key] =
            key === 'roomTempTargetC' || key === 'roomTempToleranceC' ? (value as number).toFixed(1) : value;
        }
        return { patch, changes };
      },
      (manager, changes) =>
        recordSharedPlanChange(manager, actor, { benchProfileId: id }, 'roundup.bench_profile_edited', {
          benchProfileId: id,
          changes,
        }),
    );
  }
}
