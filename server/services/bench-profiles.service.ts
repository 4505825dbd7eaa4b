import type { DataSource, EntityManager } from 'typeorm';
import type { z } from 'zod';
import { BenchProfileEntity } from '../entities/bench-profile.entity';
import { conflict, notFound } from '../errors';
import { recordAudit } from './audit.service';
import { archivedWhere, refusingDuplicates } from '../lib/database-errors';
import { fieldChanges } from '../lib/field-changes';
import { benchProfileRoundupCounts, toBenchProfileDto } from '../mappers/bench-profile';
import { recordSharedPlanChange } from '../lib/roundup-audit';
import type {
  BenchProfile,
  benchProfileListQuerySchema,
  createBenchProfileRequestSchema,
  updateBenchProfileRequestSchema,
} from '../../shared/schemas/bench-profiles';
import type { CurrentUser } from '../../shared/schemas/auth';

type CreateInput = z.output<typeof createBenchProfileRequestSchema>;
type UpdateInput = z.output<typeof updateBenchProfileRequestSchema>;
type ListQuery = z.output<typeof benchProfileListQuerySchema>;

const nameTaken = () =>
  conflict('name_taken', 'Another bench profile already has this name.', {
    name: 'Another bench profile already has this name.',
  });

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

export class BenchProfilesService {
  constructor(private readonly dataSource: DataSource) {}

  async list(query: ListQuery): Promise<BenchProfile[]> {
    const manager = this.dataSource.manager;
    const where = archivedWhere(query.archived);
    const profiles = await manager.getRepository(BenchProfileEntity).find({ where, order: { name: 'ASC' } });
    const counts = await benchProfileRoundupCounts(
      manager,
      profiles.map((p) => p.id),
    );
    return profiles.map((p) => toBenchProfileDto(p, counts.get(p.id) ?? 0));
  }

  async get(id: number, manager: EntityManager = this.dataSource.manager): Promise<BenchProfile> {
    const profile = await manager.getRepository(BenchProfileEntity).findOneBy({ id });
    if (!profile) throw notFound('That bench profile');
    return toBenchProfileDto(profile, (await benchProfileRoundupCounts(manager, [id])).get(id) ?? 0);
  }

  create(actor: CurrentUser, input: CreateInput): Promise<BenchProfile> {
    return refusingDuplicates(
      () =>
        this.dataSource.transaction(async (manager) => {
          const { identifiers } = await manager.getRepository(BenchProfileEntity).insert({
            ...input,
            roomTempTargetC: input.roomTempTargetC.toFixed(1),
            roomTempToleranceC: input.roomTempToleranceC.toFixed(1),
            createdBy: actor.id,
          });
          const id = Number(identifiers[0].id);
          await recordAudit(manager, {
            actorId: actor.id,
            action: 'bench_profile.created',
            subjectType: 'bench_profile',
            subjectId: id,
            details: { name: input.name },
          });
          return this.get(id, manager);
        }),
      nameTaken,
    );
  }

  /**
   * Edits a profile. The profile is part of the plan of every roundup that uses it, so each such roundup still
   * in planning or on the bench gets a history entry too.
   */
  update(actor: CurrentUser, id: number, input: UpdateInput): Promise<BenchProfile> {
    return refusingDuplicates(
      () =>
        this.dataSource.transaction(async (manager) => {
          const repo = manager.getRepository(BenchProfileEntity);
          const profile = await repo.findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
          if (!profile) throw notFound('That bench profile');
          const before = toBenchProfileDto(profile, 0);
          const changes = fieldChanges(before, input, fieldNames);
          const patch: Partial<BenchProfileEntity> = {};
          for (const key of Object.keys(changes) as (typeof fieldNames)[number][]) {
            const value = input[key];
            (patch as Record<string, unknown>)[key] =
              key === 'roomTempTargetC' || key === 'roomTempToleranceC' ? (value as number).toFixed(1) : value;
          }
          if (input.archived !== undefined && input.archived !== before.archived) {
            patch.archivedAt = input.archived ? new Date() : null;
            changes.archived = { from: before.archived, to: input.archived };
          }
          if (Object.keys(patch).length > 0) {
            await repo.update({ id }, patch);
            await recordAudit(manager, {
              actorId: actor.id,
              action: 'bench_profile.updated',
              subjectType: 'bench_profile',
              subjectId: id,
              details: changes,
            });
            await recordSharedPlanChange(manager, actor, { benchProfileId: id }, 'roundup.bench_profile_edited', {
              benchProfileId: id,
              changes,
            });
          }
          return this.get(id, manager);
        }),
      nameTaken,
    );
  }
}
