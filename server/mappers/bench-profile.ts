import type { EntityManager } from 'typeorm';
import type { BenchProfileEntity } from '../entities/bench-profile.entity';
import { decimalToNumber } from './dto-values';
import { countsById } from '../lib/counts-by-id';
import type { BenchProfile } from '../../shared/schemas/bench-profiles';

/** A bench profile's name and test system as stored, shown the same to staff and in a published roundup. */
export function benchProfileSystem(profile: BenchProfileEntity) {
  return {
    id: profile.id,
    name: profile.name,
    caseAndFans: profile.caseAndFans,
    cooler: profile.cooler,
    psu: profile.psu,
    memory: profile.memory,
  };
}

export function toBenchProfileDto(profile: BenchProfileEntity, roundupCount: number): BenchProfile {
  return {
    ...benchProfileSystem(profile),
    roomTempTargetC: decimalToNumber(profile.roomTempTargetC),
    roomTempToleranceC: decimalToNumber(profile.roomTempToleranceC),
    probeType: profile.probeType,
    probePlacement: profile.probePlacement,
    requiredSoakMinutes: profile.requiredSoakMinutes,
    notes: profile.notes,
    archived: profile.archivedAt != null,
    createdAt: profile.createdAt.toISOString(),
    updatedAt: profile.updatedAt.toISOString(),
    roundupCount,
  };
}

/** How many roundups use each bench profile. */
export function benchProfileRoundupCounts(manager: EntityManager, ids: number[]): Promise<Map<number, number>> {
  return countsById(
    manager,
    (inList) =>
      `SELECT bench_profile_id AS id, COUNT(*) AS n FROM roundups WHERE bench_profile_id IN (${inList}) GROUP BY bench_profile_id`,
    ids,
  );
}
