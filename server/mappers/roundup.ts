// The roundup DTOs the API sends (summaries and price bands), with progress and overdue loans computed by
// shared/domain rules.
import type { EntityManager } from 'typeorm';
import type { RoundupEntity } from '../entities/roundup.entity';
import { loadPeople, personOrNull } from './people';
import { emptyProgress, progressByRoundup } from './matrix-cell';
import { samplesOfRoundups } from './sample';
import { calendarDateIn } from '../../shared/domain/planning/loan-overdue';
import type { PriceBand } from '../../shared/domain/planning/price-band';
import type { RoundupSummary } from '../../shared/schemas/roundups';

export function bandOf(roundup: RoundupEntity): PriceBand {
  return {
    minMinor: roundup.priceMinMinor,
    maxMinor: roundup.priceMaxMinor,
    currency: roundup.currency,
    region: roundup.region,
  };
}

/** Today's calendar date where the roundup's outlet is. */
export function roundupToday(roundup: RoundupEntity, now: Date): string {
  return calendarDateIn(roundup.timeZone, now);
}

export async function roundupSummaries(
  manager: EntityManager,
  roundups: RoundupEntity[],
  now: Date,
): Promise<RoundupSummary[]> {
  const ids = roundups.map((r) => r.id);
  const progress = await progressByRoundup(manager, ids);
  const entryCounts = new Map<string, number>();
  if (ids.length > 0) {
    const rows: { roundup_id: number; kind: string; n: string }[] = await manager.query(
      `SELECT roundup_id, kind, COUNT(*) AS n FROM roundup_entries WHERE roundup_id IN (${ids.map(() => '?').join(',')})
       GROUP BY roundup_id, kind`,
      ids,
    );
    for (const row of rows) entryCounts.set(`${row.roundup_id}:${row.kind}`, Number(row.n));
  }
  const overdue = new Map<number, number>();
  for (const sample of await samplesOfRoundups(manager, roundups, now, { onlyOpenLoans: true })) {
    if (sample.overdue) overdue.set(sample.roundupId, (overdue.get(sample.roundupId) ?? 0) + 1);
  }
  const people = await loadPeople(
    manager,
    roundups.map((r) => r.createdBy),
  );
  return roundups.map((roundup) => ({
    id: roundup.id,
    title: roundup.title,
    category: roundup.category as RoundupSummary['category'],
    platform: roundup.platform,
    state: roundup.state,
    priceBand: bandOf(roundup),
    targetPublishDate: roundup.targetPublishDate,
    timeZone: roundup.timeZone,
    benchProfileId: roundup.benchProfileId,
    testedEntryCount: entryCounts.get(`${roundup.id}:tested`) ?? 0,
    referenceEntryCount: entryCounts.get(`${roundup.id}:reference`) ?? 0,
    progress: progress.get(roundup.id) ?? emptyProgress(),
    overdueSampleCount: overdue.get(roundup.id) ?? 0,
    createdBy: personOrNull(people, roundup.createdBy),
    stateChangedAt: roundup.stateChangedAt.toISOString(),
    createdAt: roundup.createdAt.toISOString(),
    updatedAt: roundup.updatedAt.toISOString(),
  }));
}
