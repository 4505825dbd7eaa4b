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
import { findRoundup, lockRoundup } from '../lib/roundup-access';
import { recordAudit } from './audit.service';
import { methodologyDraft } from '../../shared/domain/editorial/methodology-draft';
import { sectionKindLabels, writeUpBlockingReasons } from '../../shared/domain/editorial/section-states';
import { writeUpReadableStates } from '../../shared/domain/editorial/write-up-availability';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import type { CurrentUser } from '../../shared/schemas/auth';
import { emptyWriteUpDocument, type BlockNode, type WriteUpDocument } from '../../shared/schemas/write-up-document';

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
  constructor(private readonly dataSource: DataSource) {}

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
        await recordAudit(manager, {
          actorId: actor?.id ?? null,
          action: 'write-up.sections-created',
          subjectType: 'roundup',
          subjectId: roundupId,
          details: { sections: created },
        });
      }
    });
  }

  /**
   * What in the write-up keeps the roundup from being ready, in plain sentences (empty when every section is signed
   * off with no open comment thread). The roundup's readiness check lists these beside the charts' reasons.
   */
  async sectionsBlocking(roundupId: number): Promise<string[]> {
    await this.ensureSections(roundupId);
    const manager = this.dataSource.manager;
    const sections = await manager
      .getRepository(WriteUpSectionEntity)
      .find({ where: { roundupId }, order: { position: 'ASC' } });
    const openThreads = await this.openThreadCounts(
      manager,
      sections.map((s) => s.id),
    );
    return writeUpBlockingReasons(
      sections.map((section) => ({
        title: section.title,
        reviewState: section.reviewState,
        openThreadCount: openThreads.get(section.id) ?? 0,
      })),
    );
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
