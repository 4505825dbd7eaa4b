import type { DataSource } from 'typeorm';
import { RoundupScheduleEntity } from '../entities/roundup-schedule.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { PublishedPageCache } from '../publishing/published-page-cache';
import { loadPreviewSecret } from '../publishing/preview-links';
import { readerSiteRenderer } from '../publishing/reader-site-renderer';
import { PublishingService } from '../services/publishing.service';
import { instantToZonedTime, zonedTimeToInstant } from '../../shared/domain/publishing/zoned-time';

/**
 * The demo's live roundups (seeded Live) go through the same publication as a scheduled roundup: published at 09:00
 * in their zone on the day they went live, with frozen data and rendered pages, so the reader site serves them from
 * its snapshot after `npm start`.
 */
export async function publishDemoRoundup(dataSource: DataSource, now = new Date()): Promise<void> {
  const live = await dataSource.getRepository(RoundupEntity).findBy({ state: 'live' });
  for (const roundup of live) await publishOne(dataSource, roundup, now);
}

async function publishOne(dataSource: DataSource, roundup: RoundupEntity, now: Date): Promise<void> {
  const published = await dataSource.query('SELECT 1 FROM roundup_publications WHERE roundup_id = ? LIMIT 1', [
    roundup.id,
  ]);
  if ((published as unknown[]).length > 0) return;
  const day = instantToZonedTime(
    new Date(Math.min(roundup.stateChangedAt.getTime(), now.getTime() - 86_400_000)),
    roundup.timeZone,
  ).date;
  const publishing = new PublishingService(dataSource, {
    renderer: readerSiteRenderer(dataSource, { baseUrl: process.env.PUBLIC_SITE_URL ?? 'http://127.0.0.1:3000' }),
    pages: new PublishedPageCache(dataSource),
    previewSecret: () => loadPreviewSecret(dataSource, process.env.PREVIEW_LINK_SECRET),
  });
  const zoned = zonedTimeToInstant({ date: day, time: '09:00', timeZone: roundup.timeZone });
  if (!zoned.ok) return;
  await dataSource.transaction(async (manager) => {
    await manager
      .getRepository(RoundupEntity)
      .update({ id: roundup.id }, { state: 'scheduled', stateChangedAt: zoned.instant });
    await manager.getRepository(RoundupScheduleEntity).insert({
      roundupId: roundup.id,
      publishAt: zoned.instant,
      localDate: day,
      localTime: '09:00',
      timeZone: roundup.timeZone,
      scheduledBy: roundup.createdBy,
      updatedAt: zoned.instant,
    });
  });
  await publishing.publishDue(roundup.id, now);
}
