import type { DataSource, EntityManager } from 'typeorm';
import { RoundupPublicationEntity, type PublicationKind } from '../entities/roundup-publication.entity';
import { RoundupScheduleEntity } from '../entities/roundup-schedule.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { AppError, invalid } from '../errors';
import { systemClock, type Clock } from '../jobs/clock';
import { cancelJob, enqueueJob } from '../jobs/enqueue';
import { RetryJobLater } from '../jobs/job-registry';
import { lockRoundup, findRoundup } from '../lib/roundup-access';
import { recordAction } from './audit.service';
import { loadPeople, personOrNull } from '../mappers/people';
import { storeRenderedPages, type PublishedPageCache } from '../publishing/published-page-cache';
import type { FrozenRoundup, PublicSiteRenderer, PublishedNote } from '../publishing/public-site-renderer';
import { createPreviewToken, verifyPreviewToken } from '../publishing/preview-links';
import { roundupStateLabels } from '../../shared/domain/planning/roundup-states';
import {
  formatUtcOffset,
  instantToZonedTime,
  zonedTimeToInstant,
  zoneOffsetMinutes,
} from '../../shared/domain/publishing/zoned-time';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { RoundupPublishing, ScheduleRoundupRequest } from '../../shared/schemas/publishing';

function isAmbiguous(schedule: RoundupScheduleEntity): boolean {
  const zoned = zonedTimeToInstant({ date: schedule.localDate, time: schedule.localTime, timeZone: schedule.timeZone });
  return zoned.ok && zoned.ambiguous;
}

export type PreviewOutcome =
  { ok: true; html: string } | { ok: false; reason: 'malformed' | 'bad-signature' | 'expired' | 'gone' };

/** 422 `not_ready`: the message names every blocker; `details.problems` lists them with their links. */
function notReady(what: string, problems: ReadinessProblem[]) {
  return new AppError('not_ready', 422, `${what}: ${problems.map((p) => p.message).join(' ')}`, undefined, {
    problems,
  });
}

export const publishRoundupJobKind = 'publish-roundup';
export const publishJobKey = (roundupId: number) => `${publishRoundupJobKind}:${roundupId}`;

/** One thing that stands in the way of scheduling a roundup, with the staff screen where it is fixed. */
export interface ReadinessProblem {
  message: string;
  link: string | null;
}

/**
 * What stands in the way of scheduling or publishing a roundup; an empty list means it is ready. Several checks may
 * apply. Checks run outside the roundup's row lock (the editorial checks open their own transactions).
 */
export type ReadinessCheck = (
  manager: EntityManager,
  roundup: RoundupEntity,
) => Promise<(ReadinessProblem | string)[]> | (ReadinessProblem | string)[];

/** A roundup is scheduled from In review (and stays schedulable while Scheduled, to move its time). */
export const inReviewReadiness: ReadinessCheck = (_manager, roundup) =>
  roundup.state === 'in-review' || roundup.state === 'scheduled'
    ? []
    : [
        {
          message: `Only a roundup In review can be scheduled; this one is ${roundupStateLabels[roundup.state]}.`,
          link: `/roundups/${roundup.id}/readiness`,
        },
      ];

/** Told of every publication inside its transaction (the go-live mail queues its outbox here). */
export interface PublicationEvent {
  roundupId: number;
  publicationId: number;
  version: number;
  kind: PublicationKind;
  note: string | null;
  publishedAt: Date;
  model: FrozenRoundup;
}
export type PublicationListener = (manager: EntityManager, event: PublicationEvent) => Promise<void>;

export interface PublishingOptions {
  renderer: PublicSiteRenderer;
  pages: PublishedPageCache;
  previewSecret: () => Promise<Buffer>;
  clock?: Clock;
  readinessChecks?: ReadinessCheck[];
}

/**
 * Embargo publishing: schedule a ready roundup for a local date and time in a zone, reschedule or unschedule it,
 * publish it exactly once when the job runner reaches its time, publish later updates with a dated note, and sign
 * preview links. A publication changes the state, writes the publication row with the frozen published data and
 * stores the rendered public pages in one transaction.
 */
export class PublishingService {
  private readonly renderer: PublicSiteRenderer;
  private readonly pages: PublishedPageCache;
  private readonly clock: Clock;
  private readonly readinessChecks: ReadinessCheck[];
  private readonly listeners: PublicationListener[] = [];
  private readonly previewSecret: () => Promise<Buffer>;

  constructor(
    private readonly dataSource: DataSource,
    options: PublishingOptions,
  ) {
    this.renderer = options.renderer;
    this.pages = options.pages;
    this.clock = options.clock ?? systemClock;
    this.readinessChecks = options.readinessChecks ?? [inReviewReadiness];
    this.previewSecret = options.previewSecret;
  }

  /** Adds a check a roundup must pass before it may be scheduled (e.g. every chart and section ready). */
  addReadinessCheck(check: ReadinessCheck): void {
    this.readinessChecks.push(check);
  }

  /** Runs inside every publication's transaction; a listener that throws rolls the publication back. */
  onPublication(listener: PublicationListener): void {
    this.listeners.push(listener);
  }

  get publicPrefixes(): readonly string[] {
    return this.renderer.publicPrefixes;
  }

  async status(roundupId: number, manager: EntityManager = this.dataSource.manager): Promise<RoundupPublishing> {
    const roundup = await findRoundup(manager, roundupId);
    const schedule = await manager.getRepository(RoundupScheduleEntity).findOneBy({ roundupId });
    const publications = await manager.getRepository(RoundupPublicationEntity).find({
      where: { roundupId },
      order: { version: 'ASC' },
      select: {
        id: true,
        roundupId: true,
        version: true,
        kind: true,
        note: true,
        publishedAt: true,
        publishedBy: true,
      },
    });
    const people = await loadPeople(
      manager,
      publications.map((p) => p.publishedBy),
    );
    const live = roundup.state === 'live' || roundup.state === 'updated';
    const problems = live ? [] : await this.readinessProblems(manager, roundup);
    const latest = publications.length ? await this.latestModel(manager, roundupId) : null;
    return {
      roundupId,
      state: roundup.state,
      readiness: { ready: problems.length === 0, problems },
      schedule:
        schedule && roundup.state === 'scheduled'
          ? {
              publishAt: schedule.publishAt.toISOString(),
              date: schedule.localDate,
              time: schedule.localTime,
              timeZone: schedule.timeZone,
              utcOffset: formatUtcOffset(zoneOffsetMinutes(schedule.timeZone, schedule.publishAt)),
              ambiguous: isAmbiguous(schedule),
            }
          : null,
      publications: publications.map((p) => ({
        version: p.version,
        kind: p.kind,
        note: p.note,
        publishedAt: p.publishedAt.toISOString(),
        publishedBy: personOrNull(people, p.publishedBy),
      })),
      publicPath: latest?.path ?? null,
    };
  }

  /** Schedules an In review roundup, or moves the time of a scheduled one. */
  async schedule(actor: CurrentUser, roundupId: number, input: ScheduleRoundupRequest): Promise<RoundupPublishing> {
    const zoned = zonedTimeToInstant(input);
    if (!zoned.ok) {
      const field = zoned.reason === 'invalid-date' ? 'date' : zoned.reason === 'invalid-zone' ? 'timeZone' : 'time';
      throw invalid(zoned.message, { [field]: zoned.message });
    }
    const now = this.clock.now();
    if (zoned.instant.getTime() <= now.getTime()) {
      const message = `That time has passed: it is ${instantToZonedTime(now, input.timeZone).date} ${instantToZonedTime(now, input.timeZone).time} in ${input.timeZone} now.`;
      throw invalid(message, { time: message });
    }
    // Readiness first, outside the row lock: a roundup with blockers is refused with every blocker listed.
    const current = await findRoundup(this.dataSource.manager, roundupId);
    const assertSchedulable = (state: RoundupEntity['state']) => {
      if (state !== 'in-review' && state !== 'scheduled') {
        throw new AppError(
          'not_schedulable',
          409,
          `The roundup is ${roundupStateLabels[state]}: only a roundup In review can be scheduled.`,
        );
      }
    };
    assertSchedulable(current.state);
    const problems = await this.readinessProblems(this.dataSource.manager, current);
    if (problems.length > 0) throw notReady('The roundup is not ready to schedule', problems);
    await this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId);
      assertSchedulable(roundup.state);
      const previous = await manager.getRepository(RoundupScheduleEntity).findOneBy({ roundupId });
      await manager.getRepository(RoundupScheduleEntity).save({
        roundupId,
        publishAt: zoned.instant,
        localDate: input.date,
        localTime: input.time,
        timeZone: input.timeZone,
        scheduledBy: actor.id,
        updatedAt: now,
      });
      if (roundup.state !== 'scheduled') {
        await manager
          .getRepository(RoundupEntity)
          .update({ id: roundupId }, { state: 'scheduled', stateChangedAt: now });
      }
      await enqueueJob(
        manager,
        {
          kind: publishRoundupJobKind,
          payload: { roundupId },
          runAt: zoned.instant,
          uniqueKey: publishJobKey(roundupId),
        },
        'replace',
      );
      const rescheduled = roundup.state === 'scheduled';
      const action = rescheduled ? 'roundup.rescheduled' : 'roundup.scheduled';
      await recordAction(manager, actor, action, ['roundup', roundupId], {
        publishAt: zoned.instant.toISOString(),
        date: input.date,
        time: input.time,
        timeZone: input.timeZone,
        ...(rescheduled && previous ? { previousPublishAt: previous.publishAt.toISOString() } : {}),
        ...(rescheduled ? {} : { from: roundup.state, to: 'scheduled' }),
      });
    });
    return this.status(roundupId);
  }

  /** Takes a scheduled roundup off the schedule: back to In review, its publish job cancelled. */
  async unschedule(actor: CurrentUser, roundupId: number): Promise<RoundupPublishing> {
    await this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId);
      if (roundup.state !== 'scheduled') {
        throw new AppError(
          'not_scheduled',
          409,
          `The roundup is ${roundupStateLabels[roundup.state]}, not Scheduled: there is no schedule to remove.`,
        );
      }
      const now = this.clock.now();
      const schedule = await manager.getRepository(RoundupScheduleEntity).findOneBy({ roundupId });
      await manager.getRepository(RoundupScheduleEntity).delete({ roundupId });
      await manager.getRepository(RoundupEntity).update({ id: roundupId }, { state: 'in-review', stateChangedAt: now });
      await cancelJob(manager, publishJobKey(roundupId), now);
      await recordAction(manager, actor, 'roundup.unscheduled', ['roundup', roundupId], {
        from: 'scheduled',
        to: 'in-review',
        publishAt: schedule?.publishAt.toISOString() ?? null,
      });
    });
    return this.status(roundupId);
  }

  /**
   * The publish job: makes a scheduled roundup live once its time has come. Runs under the roundup's row lock and
   * writes version 1 of its publications, so a second runner (or a retry) finds it live and does nothing; a job
   * that arrives early asks to be run again at the scheduled time.
   */
  async publishDue(roundupId: number, now: Date): Promise<'published' | 'refused' | 'nothing-to-do'> {
    // Whatever changed since scheduling, a roundup with blockers is not published: it goes back to In review, where
    // the editor sees what blocks it, and the refusal is in the audit log.
    const current = await this.dataSource.getRepository(RoundupEntity).findOneBy({ id: roundupId });
    const problems =
      current?.state === 'scheduled' ? await this.readinessProblems(this.dataSource.manager, current) : [];
    const outcome = await this.dataSource.transaction(async (manager) => {
      const roundup = await manager.getRepository(RoundupEntity).findOne({
        where: { id: roundupId },
        lock: { mode: 'pessimistic_write' },
      });
      if (!roundup || roundup.state !== 'scheduled') return 'nothing-to-do' as const;
      const schedule = await manager.getRepository(RoundupScheduleEntity).findOneBy({ roundupId });
      if (!schedule) return 'nothing-to-do' as const;
      if (schedule.publishAt.getTime() > now.getTime()) {
        throw new RetryJobLater('The roundup is not due yet.', schedule.publishAt.getTime() - now.getTime());
      }
      if (await manager.getRepository(RoundupPublicationEntity).existsBy({ roundupId, version: 1 })) {
        return 'nothing-to-do' as const;
      }
      if (problems.length > 0) {
        await manager.getRepository(RoundupScheduleEntity).delete({ roundupId });
        await manager
          .getRepository(RoundupEntity)
          .update({ id: roundupId }, { state: 'in-review', stateChangedAt: now });
        await recordAction(manager, null, 'roundup.publish_refused', ['roundup', roundupId], {
          from: 'scheduled',
          to: 'in-review',
          publishAt: schedule.publishAt.toISOString(),
          problems: problems.map((p) => p.message),
        });
        return 'refused' as const;
      }
      await this.writePublication(manager, roundup, {
        version: 1,
        kind: 'publication',
        note: null,
        publishedAt: schedule.publishAt,
        updatedAt: schedule.publishAt,
        corrections: [],
        actorId: null,
        now,
        nextState: 'live',
      });
      await recordAction(manager, null, 'roundup.published', ['roundup', roundupId], {
        from: 'scheduled',
        to: 'live',
        publishAt: schedule.publishAt.toISOString(),
        at: now.toISOString(),
      });
      return 'published' as const;
    });
    if (outcome === 'published') await this.pages.reload();
    return outcome;
  }

  /** Publishes the roundup's current data to readers as a dated update or correction (Live → Updated). */
  async publishUpdate(
    actor: CurrentUser,
    roundupId: number,
    input: { kind: 'update' | 'correction'; note: string },
  ): Promise<RoundupPublishing> {
    const result = await this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId);
      if (roundup.state !== 'live' && roundup.state !== 'updated') {
        throw new AppError(
          'not_live',
          409,
          `The roundup is ${roundupStateLabels[roundup.state]}: only a Live roundup can publish an update.`,
        );
      }
      const now = this.clock.now();
      const publications = await manager.getRepository(RoundupPublicationEntity).find({
        where: { roundupId },
        order: { version: 'ASC' },
        select: { id: true, version: true, kind: true, note: true, publishedAt: true },
      });
      const first = publications[0];
      const corrections: PublishedNote[] = publications
        .filter((p) => p.kind !== 'publication' && p.note)
        .map((p) => ({
          at: p.publishedAt.toISOString(),
          kind: p.kind as 'update' | 'correction',
          note: p.note as string,
        }));
      corrections.push({ at: now.toISOString(), kind: input.kind, note: input.note });
      const version = (publications.at(-1)?.version ?? 0) + 1;
      const path = (await this.latestModel(manager, roundupId))?.path;
      await this.writePublication(manager, roundup, {
        version,
        kind: input.kind,
        note: input.note,
        publishedAt: first?.publishedAt ?? now,
        updatedAt: now,
        corrections,
        actorId: actor.id,
        now,
        nextState: 'updated',
        path,
      });
      const action = input.kind === 'correction' ? 'roundup.correction_published' : 'roundup.update_published';
      await recordAction(manager, actor, action, ['roundup', roundupId], {
        version,
        note: input.note,
        ...(roundup.state === 'live' ? { from: 'live', to: 'updated' } : {}),
      });
      return this.status(roundupId, manager);
    });
    await this.pages.reload();
    return result;
  }

  /** A signed link to the roundup's page as it stands, readable without an account until it expires. */
  async createPreviewLink(actor: CurrentUser, roundupId: number, hours: number) {
    const manager = this.dataSource.manager;
    await findRoundup(manager, roundupId);
    const expiresAt = Math.floor(this.clock.now().getTime() / 1000) + hours * 3600;
    const token = createPreviewToken(await this.previewSecret(), { roundupId, expiresAt });
    await recordAction(manager, actor, 'roundup.preview_link_created', ['roundup', roundupId], {
      expiresAt: new Date(expiresAt * 1000).toISOString(),
    });
    return { path: `/preview/${token}`, expiresAt: new Date(expiresAt * 1000).toISOString() };
  }

  /** The preview page for a token, or why there is none. */
  async preview(token: string): Promise<PreviewOutcome> {
    const check = verifyPreviewToken(await this.previewSecret(), token, this.clock.now());
    if (!check.ok) return check;
    const manager = this.dataSource.manager;
    const roundup = await manager.getRepository(RoundupEntity).findOneBy({ id: check.claims.roundupId });
    if (!roundup) return { ok: false, reason: 'gone' };
    const now = this.clock.now();
    const model = await this.renderer.freeze(manager, roundup.id, {
      publishedAt: now,
      updatedAt: now,
      corrections: [],
    });
    return { ok: true, html: await this.renderer.renderPreview(model) };
  }

  /** The latest frozen model of every published roundup, newest first publication first. */
  async publishedModels(manager: EntityManager = this.dataSource.manager): Promise<FrozenRoundup[]> {
    const rows = (await manager.query(
      `SELECT p.model, first.published_at AS first_published
         FROM roundup_publications p
         JOIN (SELECT roundup_id, MAX(version) AS version FROM roundup_publications GROUP BY roundup_id) latest
           ON latest.roundup_id = p.roundup_id AND latest.version = p.version
         JOIN roundup_publications first ON first.roundup_id = p.roundup_id AND first.version = 1
        ORDER BY first.published_at DESC, p.roundup_id DESC`,
    )) as { model: string | FrozenRoundup }[];
    return rows.map((row) => (typeof row.model === 'string' ? (JSON.parse(row.model) as FrozenRoundup) : row.model));
  }

  /** Renders every public page from the stored models again (after the renderers change) and stores what changed. */
  async rerenderAll(): Promise<string[]> {
    const touched = await this.dataSource.transaction(async (manager) => {
      const pages = await this.renderer.renderPages(await this.publishedModels(manager));
      return storeRenderedPages(manager, pages, this.clock.now());
    });
    await this.pages.reload();
    return touched;
  }

  private async latestModel(manager: EntityManager, roundupId: number): Promise<FrozenRoundup | null> {
    const latest = await manager
      .getRepository(RoundupPublicationEntity)
      .findOne({ where: { roundupId }, order: { version: 'DESC' } });
    return (latest?.model as FrozenRoundup | undefined) ?? null;
  }

  private async readinessProblems(manager: EntityManager, roundup: RoundupEntity): Promise<ReadinessProblem[]> {
    const problems: ReadinessProblem[] = [];
    for (const check of this.readinessChecks) {
      for (const problem of await check(manager, roundup)) {
        problems.push(typeof problem === 'string' ? { message: problem, link: null } : problem);
      }
    }
    return problems;
  }

  private async writePublication(
    manager: EntityManager,
    roundup: RoundupEntity,
    input: {
      version: number;
      kind: PublicationKind;
      note: string | null;
      publishedAt: Date;
      updatedAt: Date;
      corrections: PublishedNote[];
      actorId: number | null;
      now: Date;
      nextState: 'live' | 'updated';
      path?: string;
    },
  ): Promise<void> {
    const model = await this.renderer.freeze(manager, roundup.id, {
      publishedAt: input.publishedAt,
      updatedAt: input.updatedAt,
      corrections: input.corrections,
      path: input.path,
    });
    const { identifiers } = await manager.getRepository(RoundupPublicationEntity).insert({
      roundupId: roundup.id,
      version: input.version,
      kind: input.kind,
      note: input.note,
      publishedAt: input.kind === 'publication' ? input.publishedAt : input.now,
      publishedBy: input.actorId,
      model,
    });
    if (roundup.state !== input.nextState) {
      await manager
        .getRepository(RoundupEntity)
        .update({ id: roundup.id }, { state: input.nextState, stateChangedAt: input.now });
    }
    for (const listener of this.listeners) {
      await listener(manager, {
        roundupId: roundup.id,
        publicationId: Number(identifiers[0].id),
        version: input.version,
        kind: input.kind,
        note: input.note,
        publishedAt: input.kind === 'publication' ? input.publishedAt : input.now,
        model,
      });
    }
    const pages = await this.renderer.renderPages(await this.publishedModels(manager));
    await storeRenderedPages(manager, pages, input.now);
  }
}
