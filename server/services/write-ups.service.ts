import { In, IsNull, type DataSource, type EntityManager } from 'typeorm';
import { BenchProfileEntity } from '../entities/bench-profile.entity';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { ProductEntity } from '../entities/product.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { WriteUpCommentEntity } from '../entities/write-up-comment.entity';
import { WriteUpRevisionEntity } from '../entities/write-up-revision.entity';
import { WriteUpSectionEntity } from '../entities/write-up-section.entity';
import { renderSectionHtml } from '../editorial/render-write-up';
import { loadWriteUpLiveData, staffPhotoAddress, type PhotoAddress } from '../editorial/write-up-live-data';
import { AppError, forbidden, invalid, notFound } from '../errors';
import { findRoundup, lockRoundup } from '../lib/roundup-access';
import { loadPeople, personOrNull } from '../mappers/people';
import { recordAction } from './audit.service';
import type { TestRunsService } from './test-runs.service';
import { may, writeUpApprovers, writeUpWriters } from '../../shared/access/roles';
import { methodologyDraft } from '../../shared/domain/editorial/methodology-draft';
import {
  reviewStateAfterEdit,
  sectionKindLabels,
  sectionReviewMove,
  sectionReviewMoves,
  writeUpBlockers,
  type SectionKind,
  type SectionReviewMove,
  type SectionReviewState,
} from '../../shared/domain/editorial/section-states';
import { writeUpLockedReason, writeUpReadableStates } from '../../shared/domain/editorial/write-up-availability';
import type { PersonRef } from '../../shared/schemas/planning-fields';
import type {
  CommentThread,
  LiveBlockPreview,
  ParsedAddCommentRequest,
  ParsedSaveSectionRequest,
  RevisionDetail,
  RevisionSummary,
  SectionDetail,
  SectionSummary,
  StaleVersionDetails,
  WriteUpOverview,
} from '../../shared/schemas/write-ups';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import type { CurrentUser } from '../../shared/schemas/auth';
import {
  emptyWriteUpDocument,
  liveBlockKinds,
  type BlockNode,
  type WriteUpDocument,
} from '../../shared/schemas/write-up-document';

/** Saves by one author within this time of their last share one revision. */
const sittingMilliseconds = 10 * 60 * 1000;

/** Whether two documents are the same (key order aside: both come from the same editor and schema). */
function sameDocument(a: WriteUpDocument, b: WriteUpDocument): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

function revisionSummary(row: WriteUpRevisionEntity, people: Map<number, PersonRef>): RevisionSummary {
  return {
    id: row.id,
    kind: row.kind,
    version: row.version,
    basedOnVersion: row.basedOnVersion,
    restoredFromId: row.restoredFromId,
    title: row.title,
    author: personOrNull(people, row.authorId),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

interface PlannedSection {
  key: string;
  kind: WriteUpSectionEntity['kind'];
  entryId: number | null;
  title: string;
  draft: () => WriteUpDocument;
}

/** A product section starts with the board's power design as a live block, under a line to replace. */
function productDraft(entryId: number): WriteUpDocument {
  const content: BlockNode[] = [
    { type: 'paragraph', content: [{ type: 'text', text: 'What stands out about this board.' }] },
    { type: 'liveBlock', attrs: { block: 'power-design', entryId } },
  ];
  return { type: 'doc', content };
}

/**
 * A roundup's write-up: the sections, their saved versions and revisions, their review and the comment threads on
 * them. Sections are created when the write-up is first opened in Writing; product sections follow the tested
 * entries.
 */
export class WriteUpsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly testRuns: TestRunsService,
  ) {}

  // ---- reading ----

  async overview(roundupId: number, user: CurrentUser): Promise<WriteUpOverview> {
    await this.ensureSections(roundupId, null);
    const manager = this.dataSource.manager;
    const roundup = await findRoundup(manager, roundupId);
    const sections = await manager
      .getRepository(WriteUpSectionEntity)
      .find({ where: { roundupId }, order: { position: 'ASC' } });
    const lockedReason = writeUpLockedReason(roundup.state);
    return {
      roundupId,
      roundupTitle: roundup.title,
      roundupState: roundup.state,
      editable: lockedReason === null && may(user.role, writeUpWriters),
      lockedReason,
      sections: await this.summaries(manager, sections, user, lockedReason),
      blocking: await this.sectionsBlocking(roundupId),
    };
  }

  async section(sectionId: number, user: CurrentUser): Promise<SectionDetail> {
    const manager = this.dataSource.manager;
    const section = await this.findSection(manager, sectionId);
    const roundup = await findRoundup(manager, section.roundupId);
    const lockedReason = writeUpLockedReason(roundup.state);
    const [summary] = await this.summaries(manager, [section], user, lockedReason);
    const live = await loadWriteUpLiveData(manager, this.testRuns, section.roundupId);
    const liveBlocks: LiveBlockPreview[] = [];
    for (const entry of live.entries) {
      for (const block of liveBlockKinds) {
        const doc: WriteUpDocument = {
          type: 'doc',
          content: [{ type: 'liveBlock', attrs: { block, entryId: entry.entryId } }],
        };
        liveBlocks.push({
          block,
          entryId: entry.entryId,
          productName: entry.productName,
          html: await renderSectionHtml(doc, live),
        });
      }
    }
    return {
      ...summary,
      content: section.content,
      editable: lockedReason === null && may(user.role, writeUpWriters),
      lockedReason,
      liveBlocks,
      photos: live.photos.map((photo) => {
        const smallest = [...photo.derivatives].filter((d) => d.format === 'webp').sort((a, b) => a.width - b.width)[0];
        return {
          id: photo.id,
          entryId: photo.entryId,
          productName: live.productNameOf(photo.entryId),
          altText: photo.altText,
          caption: photo.caption,
          width: photo.width,
          height: photo.height,
          previewUrl: smallest ? staffPhotoAddress(photo.id, smallest.width, 'webp') : '',
        };
      }),
    };
  }

  // ---- saving ----

  /**
   * Saves a section's text. The save names the version it started from: when someone saved after that, the save is
   * refused with 409 and the refused text is kept as a revision, so nothing typed is lost. Changing a signed-off
   * section hands it back to drafting.
   */
  async save(actor: CurrentUser, sectionId: number, input: ParsedSaveSectionRequest): Promise<SectionSummary> {
    const refused = await this.dataSource.transaction(async (manager) => {
      const section = await this.lockSection(manager, sectionId);
      await this.assertEditable(manager, section.roundupId);
      const title = input.title ?? section.title;
      if (section.version !== input.baseVersion) {
        const copy = await manager.getRepository(WriteUpRevisionEntity).save(
          manager.getRepository(WriteUpRevisionEntity).create({
            sectionId,
            kind: 'refused-copy',
            version: null,
            basedOnVersion: input.baseVersion,
            title,
            content: input.content,
            authorId: actor.id,
          }),
        );
        return { section, copyId: copy.id };
      }
      if (title === section.title && sameDocument(section.content, input.content)) return null;
      await this.writeVersion(manager, actor, section, {
        title,
        content: input.content,
        kind: 'save',
        restoredFromId: null,
      });
      return null;
    });
    if (refused) {
      const people = await loadPeople(this.dataSource.manager, [refused.section.updatedBy]);
      const details: StaleVersionDetails = {
        current: {
          version: refused.section.version,
          title: refused.section.title,
          content: refused.section.content,
          updatedAt: refused.section.updatedAt.toISOString(),
          updatedBy: personOrNull(people, refused.section.updatedBy),
        },
        refusedCopyRevisionId: refused.copyId,
      };
      const who = details.current.updatedBy?.displayName ?? 'Someone';
      throw new AppError(
        'stale_version',
        409,
        `${who} saved this section after you opened it (now version ${refused.section.version}). Your text was kept: reload theirs, or keep your copy.`,
        undefined,
        details,
      );
    }
    return this.summaryOf(sectionId, actor);
  }

  // ---- review ----

  async move(actor: CurrentUser, sectionId: number, move: SectionReviewMove, note: string | null = null) {
    await this.dataSource.transaction(async (manager) => {
      const section = await this.lockSection(manager, sectionId);
      await this.assertEditable(manager, section.roundupId);
      if (move !== 'hand-to-editor' && !may(actor.role, writeUpApprovers))
        throw forbidden('Only an editor may do this.');
      const outcome = sectionReviewMove(section.reviewState, move);
      if (!outcome.ok) throw new AppError('review_move_refused', 422, outcome.reason);
      const from = section.reviewState;
      section.reviewState = outcome.to;
      section.reviewStateChangedAt = new Date();
      section.reviewStateChangedBy = actor.id;
      await manager.getRepository(WriteUpSectionEntity).save(section);
      if (note) {
        await manager
          .getRepository(WriteUpCommentEntity)
          .save(
            manager
              .getRepository(WriteUpCommentEntity)
              .create({ sectionId, parentId: null, authorId: actor.id, body: note }),
          );
      }
      await recordAction(manager, actor, 'write-up.review-moved', ['roundup', section.roundupId], {
        sectionId,
        title: section.title,
        move,
        from,
        to: outcome.to,
      });
    });
    return this.summaryOf(sectionId, actor);
  }

  // ---- revisions ----

  async revisions(sectionId: number): Promise<RevisionSummary[]> {
    const manager = this.dataSource.manager;
    await this.findSection(manager, sectionId);
    const rows = await manager
      .getRepository(WriteUpRevisionEntity)
      .find({ where: { sectionId }, order: { id: 'DESC' }, take: 200 });
    const people = await loadPeople(
      manager,
      rows.map((r) => r.authorId),
    );
    return rows.map((row) => revisionSummary(row, people));
  }

  async revision(sectionId: number, revisionId: number): Promise<RevisionDetail> {
    const manager = this.dataSource.manager;
    const section = await this.findSection(manager, sectionId);
    const row = await manager.getRepository(WriteUpRevisionEntity).findOneBy({ id: revisionId, sectionId });
    if (!row) throw notFound('That revision of this section');
    const people = await loadPeople(manager, [row.authorId]);
    const live = await loadWriteUpLiveData(manager, this.testRuns, section.roundupId);
    return { ...revisionSummary(row, people), content: row.content, html: await renderSectionHtml(row.content, live) };
  }

  /** Makes an earlier revision the section's text again, as a new version (history is never rewritten). */
  async restore(actor: CurrentUser, sectionId: number, revisionId: number, baseVersion: number) {
    await this.dataSource.transaction(async (manager) => {
      const section = await this.lockSection(manager, sectionId);
      await this.assertEditable(manager, section.roundupId);
      const revision = await manager.getRepository(WriteUpRevisionEntity).findOneBy({ id: revisionId, sectionId });
      if (!revision) throw notFound('That revision of this section');
      if (section.version !== baseVersion) {
        throw new AppError(
          'stale_version',
          409,
          `The section was saved again (now version ${section.version}) since you opened its history. Look at it again, then restore.`,
        );
      }
      await this.writeVersion(manager, actor, section, {
        title: revision.title,
        content: revision.content,
        kind: 'restore',
        restoredFromId: revision.id,
      });
    });
    return this.summaryOf(sectionId, actor);
  }

  // ---- comments ----

  async threads(sectionId: number): Promise<CommentThread[]> {
    const manager = this.dataSource.manager;
    await this.findSection(manager, sectionId);
    const rows = await manager.getRepository(WriteUpCommentEntity).find({ where: { sectionId }, order: { id: 'ASC' } });
    const people = await loadPeople(
      manager,
      rows.flatMap((r) => [r.authorId, r.resolvedBy]),
    );
    const person = (id: number) => personOrNull(people, id) ?? { id, displayName: 'Former staff' };
    const comment = (row: WriteUpCommentEntity) => ({
      id: row.id,
      sectionId: row.sectionId,
      parentId: row.parentId,
      author: person(row.authorId),
      body: row.body,
      createdAt: row.createdAt.toISOString(),
    });
    return rows
      .filter((row) => row.parentId === null)
      .map((root) => ({
        ...comment(root),
        resolvedAt: root.resolvedAt?.toISOString() ?? null,
        resolvedBy: root.resolvedBy === null ? null : person(root.resolvedBy),
        replies: rows.filter((row) => row.parentId === root.id).map(comment),
      }));
  }

  async addComment(actor: CurrentUser, sectionId: number, input: ParsedAddCommentRequest): Promise<CommentThread> {
    const threadId = await this.dataSource.transaction(async (manager) => {
      const section = await this.lockSection(manager, sectionId);
      const repo = manager.getRepository(WriteUpCommentEntity);
      let parentId: number | null = null;
      if (input.parentId) {
        const parent = await repo.findOneBy({ id: input.parentId, sectionId });
        if (!parent) {
          throw invalid('That comment thread is not on this section.', {
            parentId: 'Reply to a thread of this section.',
          });
        }
        // Replies attach to the thread's opening comment: threads are one level deep.
        parentId = parent.parentId ?? parent.id;
        // A reply to a resolved thread reopens it: the conversation is not over.
        await repo.update({ id: parentId }, { resolvedAt: null, resolvedBy: null });
      }
      const saved = await repo.save(repo.create({ sectionId, parentId, authorId: actor.id, body: input.body }));
      const action = parentId ? 'write-up.comment-replied' : 'write-up.comment-added';
      await recordAction(manager, actor, action, ['roundup', section.roundupId], {
        sectionId,
        commentId: saved.id,
        parentId,
      });
      return parentId ?? saved.id;
    });
    return this.threadOf(sectionId, threadId);
  }

  async setResolved(actor: CurrentUser, commentId: number, resolved: boolean): Promise<CommentThread> {
    const sectionId = await this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(WriteUpCommentEntity);
      const comment = await repo.findOne({ where: { id: commentId }, lock: { mode: 'pessimistic_write' } });
      if (!comment) throw notFound('That comment');
      if (comment.parentId !== null) {
        throw invalid('Resolve or reopen the whole thread, from its first comment.', {
          commentId: 'Use the thread’s first comment.',
        });
      }
      const section = await this.findSection(manager, comment.sectionId);
      comment.resolvedAt = resolved ? new Date() : null;
      comment.resolvedBy = resolved ? actor.id : null;
      await repo.save(comment);
      const action = resolved ? 'write-up.thread-resolved' : 'write-up.thread-reopened';
      await recordAction(manager, actor, action, ['roundup', section.roundupId], { sectionId: section.id, commentId });
      return section.id;
    });
    return this.threadOf(sectionId, commentId);
  }

  // ---- preview ----

  /** The write-up as one HTML fragment per section, in order, rendered by the one renderer from current data. */
  async renderedSections(roundupId: number, photoAddress?: PhotoAddress) {
    await this.ensureSections(roundupId);
    const manager = this.dataSource.manager;
    const roundup = await findRoundup(manager, roundupId);
    const sections = await manager
      .getRepository(WriteUpSectionEntity)
      .find({ where: { roundupId }, order: { position: 'ASC' } });
    const live = await loadWriteUpLiveData(manager, this.testRuns, roundupId, photoAddress);
    const rendered: { id: number; kind: SectionKind; title: string; reviewState: SectionReviewState; html: string }[] =
      [];
    for (const section of sections) {
      rendered.push({
        id: section.id,
        kind: section.kind,
        title: section.title,
        reviewState: section.reviewState,
        html: await renderSectionHtml(section.content, live),
      });
    }
    return { roundup, sections: rendered };
  }

  /**
   * Creates the sections the roundup does not have yet (introduction, how we tested, one per tested product,
   * conclusion) and puts them in order. Does nothing before Writing. Safe to call again.
   */
  async ensureSections(roundupId: number, actor: CurrentUser | null = null): Promise<void> {
    const roundup = await findRoundup(this.dataSource.manager, roundupId);
    if (!writeUpReadableStates.includes(roundup.state)) return;
    const existing = await this.dataSource.getRepository(WriteUpSectionEntity).findBy({ roundupId });
    const planned = await this.plannedSections(this.dataSource.manager, roundup);
    const known = new Set(existing.map((section) => section.sectionKey));
    const positionsRight = planned.every(
      (p, index) => existing.find((s) => s.sectionKey === p.key)?.position === index + 1,
    );
    if (planned.every((p) => known.has(p.key)) && positionsRight) return;

    await this.dataSource.transaction(async (manager) => {
      const locked = await lockRoundup(manager, roundupId);
      const repo = manager.getRepository(WriteUpSectionEntity);
      const current = new Map((await repo.findBy({ roundupId })).map((s) => [s.sectionKey, s]));
      const plan = await this.plannedSections(manager, locked);
      const created: string[] = [];
      // Sections for keys no longer planned (none today: entries are fixed from Writing on) keep their place last.
      let position = 0;
      for (const item of plan) {
        position += 1;
        const section = current.get(item.key);
        if (section) {
          if (section.position !== position) await repo.update({ id: section.id }, { position });
          continue;
        }
        const content = item.draft();
        const saved = await repo.save(
          repo.create({
            roundupId,
            kind: item.kind,
            entryId: item.entryId,
            sectionKey: item.key,
            position,
            title: item.title,
            content,
            version: 1,
            reviewState: 'drafting',
            reviewStateChangedAt: new Date(),
            reviewStateChangedBy: actor?.id ?? null,
            updatedBy: actor?.id ?? null,
          }),
        );
        await manager.getRepository(WriteUpRevisionEntity).save(
          manager.getRepository(WriteUpRevisionEntity).create({
            sectionId: saved.id,
            kind: 'prefill',
            version: 1,
            basedOnVersion: null,
            title: item.title,
            content,
            authorId: actor?.id ?? null,
          }),
        );
        created.push(item.key);
      }
      if (created.length > 0) {
        await recordAction(manager, actor, 'write-up.sections-created', ['roundup', roundupId], { sections: created });
      }
    });
  }

  /**
   * What in the write-up keeps the roundup from being ready, in plain sentences (empty when every section is signed
   * off with no open comment thread). The roundup's readiness check lists these beside the charts' reasons.
   */
  async sectionsBlocking(roundupId: number): Promise<string[]> {
    return (await this.sectionBlockers(roundupId)).map((blocker) => blocker.label);
  }

  /** As sectionsBlocking, each sentence with the section it is about (null when the write-up was never started). */
  async sectionBlockers(roundupId: number): Promise<{ label: string; sectionId: number | null }[]> {
    await this.ensureSections(roundupId);
    const manager = this.dataSource.manager;
    const sections = await manager
      .getRepository(WriteUpSectionEntity)
      .find({ where: { roundupId }, order: { position: 'ASC' } });
    const openThreads = await this.openThreadCounts(
      manager,
      sections.map((s) => s.id),
    );
    return writeUpBlockers(
      sections.map((section) => ({
        id: section.id,
        title: section.title,
        reviewState: section.reviewState,
        openThreadCount: openThreads.get(section.id) ?? 0,
      })),
    ).map(({ reason, section }) => ({ label: reason, sectionId: section?.id ?? null }));
  }

  // ---- helpers ----

  private async writeVersion(
    manager: EntityManager,
    actor: CurrentUser,
    section: WriteUpSectionEntity,
    change: { title: string; content: WriteUpDocument; kind: 'save' | 'restore'; restoredFromId: number | null },
  ) {
    const basedOn = section.version;
    const fromState = section.reviewState;
    section.version = basedOn + 1;
    section.title = change.title;
    section.content = change.content;
    section.updatedBy = actor.id;
    section.reviewState = reviewStateAfterEdit(fromState);
    if (section.reviewState !== fromState) {
      section.reviewStateChangedAt = new Date();
      section.reviewStateChangedBy = actor.id;
    }
    await manager.getRepository(WriteUpSectionEntity).save(section);

    const revisions = manager.getRepository(WriteUpRevisionEntity);
    const last = await revisions.findOne({ where: { sectionId: section.id }, order: { id: 'DESC' } });
    // Autosave sends a save every few seconds: one author's run of saves shares one revision, so the history shows
    // sittings, not keystrokes. A restore, another author or a pause starts a new one.
    const sameSitting =
      change.kind === 'save' &&
      last?.kind === 'save' &&
      last.authorId === actor.id &&
      last.version === basedOn &&
      Date.now() - last.updatedAt.getTime() < sittingMilliseconds;
    if (sameSitting && last) {
      await revisions.update(
        { id: last.id },
        { version: section.version, title: change.title, content: change.content },
      );
    } else {
      await revisions.save(
        revisions.create({
          sectionId: section.id,
          kind: change.kind,
          version: section.version,
          basedOnVersion: basedOn,
          restoredFromId: change.restoredFromId,
          title: change.title,
          content: change.content,
          authorId: actor.id,
        }),
      );
    }
    if (!sameSitting || section.reviewState !== fromState) {
      const action = change.kind === 'restore' ? 'write-up.revision-restored' : 'write-up.section-saved';
      await recordAction(manager, actor, action, ['roundup', section.roundupId], {
        sectionId: section.id,
        title: section.title,
        version: section.version,
        ...(change.restoredFromId ? { restoredFromId: change.restoredFromId } : {}),
        ...(section.reviewState !== fromState ? { reviewState: { from: fromState, to: section.reviewState } } : {}),
      });
    }
  }

  private async findSection(manager: EntityManager, sectionId: number): Promise<WriteUpSectionEntity> {
    const section = await manager.getRepository(WriteUpSectionEntity).findOneBy({ id: sectionId });
    if (!section) throw notFound('That write-up section');
    return section;
  }

  private async lockSection(manager: EntityManager, sectionId: number): Promise<WriteUpSectionEntity> {
    const section = await manager
      .getRepository(WriteUpSectionEntity)
      .findOne({ where: { id: sectionId }, lock: { mode: 'pessimistic_write' } });
    if (!section) throw notFound('That write-up section');
    return section;
  }

  private async assertEditable(manager: EntityManager, roundupId: number) {
    // A shared lock keeps the roundup's state still while the section changes under it.
    const roundup = await lockRoundup(manager, roundupId, 'pessimistic_read');
    const reason = writeUpLockedReason(roundup.state);
    if (reason) throw new AppError('write_up_locked', 422, reason);
  }

  private async summaryOf(sectionId: number, user: CurrentUser): Promise<SectionSummary> {
    const manager = this.dataSource.manager;
    const section = await this.findSection(manager, sectionId);
    const roundup = await findRoundup(manager, section.roundupId);
    return (await this.summaries(manager, [section], user, writeUpLockedReason(roundup.state)))[0];
  }

  private async threadOf(sectionId: number, threadId: number): Promise<CommentThread> {
    const thread = (await this.threads(sectionId)).find((t) => t.id === threadId);
    if (!thread) throw notFound('That comment thread');
    return thread;
  }

  private async summaries(
    manager: EntityManager,
    sections: WriteUpSectionEntity[],
    user: CurrentUser,
    lockedReason: string | null,
  ): Promise<SectionSummary[]> {
    const people = await loadPeople(
      manager,
      sections.flatMap((s) => [s.updatedBy, s.reviewStateChangedBy]),
    );
    const openThreads = await this.openThreadCounts(
      manager,
      sections.map((s) => s.id),
    );
    return sections.map((section) => ({
      id: section.id,
      roundupId: section.roundupId,
      kind: section.kind,
      entryId: section.entryId,
      title: section.title,
      position: section.position,
      version: section.version,
      reviewState: section.reviewState,
      reviewStateChangedAt: section.reviewStateChangedAt.toISOString(),
      reviewStateChangedBy: personOrNull(people, section.reviewStateChangedBy),
      updatedAt: section.updatedAt.toISOString(),
      updatedBy: personOrNull(people, section.updatedBy),
      openThreadCount: openThreads.get(section.id) ?? 0,
      moves:
        lockedReason !== null
          ? []
          : sectionReviewMoves.filter(
              (move) =>
                may(user.role, move === 'hand-to-editor' ? writeUpWriters : writeUpApprovers) &&
                sectionReviewMove(section.reviewState, move).ok,
            ),
    }));
  }

  protected async openThreadCounts(manager: EntityManager, sectionIds: number[]): Promise<Map<number, number>> {
    const counts = new Map<number, number>();
    if (sectionIds.length === 0) return counts;
    const rows = await manager
      .getRepository(WriteUpCommentEntity)
      .createQueryBuilder('comment')
      .select('comment.section_id', 'sectionId')
      .addSelect('COUNT(*)', 'open')
      .where({ sectionId: In(sectionIds), parentId: IsNull(), resolvedAt: IsNull() })
      .groupBy('comment.section_id')
      .getRawMany<{ sectionId: number; open: string }>();
    for (const row of rows) counts.set(Number(row.sectionId), Number(row.open));
    return counts;
  }

  private async plannedSections(manager: EntityManager, roundup: RoundupEntity): Promise<PlannedSection[]> {
    const entries = await manager
      .getRepository(RoundupEntryEntity)
      .find({ where: { roundupId: roundup.id, kind: 'tested' }, order: { position: 'ASC', id: 'ASC' } });
    const products = await manager.getRepository(ProductEntity).findBy({ id: In(entries.map((e) => e.productId)) });
    const productById = new Map(products.map((p) => [p.id, p]));
    const methodologyDoc = await this.methodologyFor(manager, roundup);
    return [
      {
        key: 'introduction',
        kind: 'introduction',
        entryId: null,
        title: sectionKindLabels.introduction,
        draft: emptyWriteUpDocument,
      },
      {
        key: 'methodology',
        kind: 'methodology',
        entryId: null,
        title: sectionKindLabels.methodology,
        draft: () => methodologyDoc,
      },
      ...entries.map((entry) => {
        const product = productById.get(entry.productId);
        return {
          key: `entry-${entry.id}`,
          kind: 'product' as const,
          entryId: entry.id,
          title: product ? productDisplayName(product) : `Product ${entry.id}`,
          draft: () => productDraft(entry.id),
        };
      }),
      {
        key: 'conclusion',
        kind: 'conclusion',
        entryId: null,
        title: sectionKindLabels.conclusion,
        draft: emptyWriteUpDocument,
      },
    ];
  }

  private async methodologyFor(manager: EntityManager, roundup: RoundupEntity): Promise<WriteUpDocument> {
    const profile = roundup.benchProfileId
      ? await manager.getRepository(BenchProfileEntity).findOneBy({ id: roundup.benchProfileId })
      : null;
    const links = await manager
      .getRepository(RoundupLoadConfigurationEntity)
      .find({ where: { roundupId: roundup.id }, order: { position: 'ASC' } });
    const configs = await manager
      .getRepository(LoadConfigurationEntity)
      .findBy({ id: In(links.map((l) => l.loadConfigurationId)) });
    const byId = new Map(configs.map((c) => [c.id, c]));
    return methodologyDraft(
      profile && {
        name: profile.name,
        caseAndFans: profile.caseAndFans,
        cooler: profile.cooler,
        psu: profile.psu,
        memory: profile.memory,
        roomTempTargetC: Number(profile.roomTempTargetC),
        roomTempToleranceC: Number(profile.roomTempToleranceC),
        probeType: profile.probeType,
        probePlacement: profile.probePlacement,
        requiredSoakMinutes: profile.requiredSoakMinutes,
      },
      links.flatMap((link) => {
        const config = byId.get(link.loadConfigurationId);
        return config
          ? [
              {
                name: config.name,
                cpuDescription: config.cpuDescription,
                settingsMode: config.settingsMode,
                fixedClockMhz: config.fixedClockMhz,
                expectedPackagePowerW: Number(config.expectedPackagePowerW),
                coreVoltageV: Number(config.coreVoltageV),
                soakMinutes: config.soakMinutes,
              },
            ]
          : [];
      }),
    );
  }
}
