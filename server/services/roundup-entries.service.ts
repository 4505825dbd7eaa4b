import { In, IsNull, type DataSource, type EntityManager } from 'typeorm';
import type { z } from 'zod';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { ProductEntity } from '../entities/product.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { SampleEntity } from '../entities/sample.entity';
import { AppError, conflict, invalid, notFound } from '../errors';
import { isDuplicateKey } from '../lib/database-errors';
import { loadPeople } from '../mappers/people';
import { priceHistoryByProduct, toProductBrief } from '../mappers/product-fields';
import { recordPlanChange } from '../lib/roundup-audit';
import { priceCheckFor, roundupEntries } from '../mappers/roundup-entry';
import { assertPlanEditable, assertRoundupExists, findRoundup, lockRoundup } from '../lib/roundup-access';
import { cellStateLabels, statesWithWork } from '../../shared/domain/planning/matrix-cell-states';
import type { CurrentUser } from '../../shared/schemas/auth';
import type {
  ParsedAddRoundupEntryRequest,
  referenceCandidatesSchema,
  RoundupEntry,
  RoundupSuggestions,
} from '../../shared/schemas/roundups';
import type { RoundupState } from '../../shared/domain/planning/roundup-states';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';

type ReferenceCandidates = z.infer<typeof referenceCandidatesSchema>['candidates'];

interface TestedIn {
  roundupId: number;
  title: string;
  state: RoundupState;
  createdAt: Date;
}

/**
 * Earlier results a product can be shown with: other roundups where it was a tested entry with at least one
 * accepted cell. Newest roundup first.
 */
async function testedElsewhere(
  manager: EntityManager,
  roundupId: number,
  productIds?: number[],
): Promise<Map<number, TestedIn[]>> {
  const qb = manager
    .getRepository(RoundupEntryEntity)
    .createQueryBuilder('e')
    .innerJoin(RoundupEntity, 'r', 'r.id = e.roundupId')
    .select([
      'e.productId AS productId',
      'r.id AS roundupId',
      'r.title AS title',
      'r.state AS state',
      'r.createdAt AS createdAt',
    ])
    .where("e.kind = 'tested'")
    .andWhere('e.roundupId <> :roundupId', { roundupId })
    .andWhere("EXISTS (SELECT 1 FROM matrix_cells c WHERE c.roundup_entry_id = e.id AND c.state = 'accepted')")
    .orderBy('r.createdAt', 'DESC')
    .addOrderBy('r.id', 'DESC');
  if (productIds) {
    if (productIds.length === 0) return new Map();
    qb.andWhere('e.productId IN (:...productIds)', { productIds });
  }
  const rows = await qb.getRawMany<{
    productId: number;
    roundupId: number;
    title: string;
    state: RoundupState;
    createdAt: Date;
  }>();
  const grouped = new Map<number, TestedIn[]>();
  for (const row of rows) {
    const list = grouped.get(Number(row.productId)) ?? [];
    list.push({ roundupId: Number(row.roundupId), title: row.title, state: row.state, createdAt: row.createdAt });
    grouped.set(Number(row.productId), list);
  }
  return grouped;
}

/** Adding and removing products, the price-band suggestions and reference candidates. */
export class RoundupEntriesService {
  constructor(private readonly dataSource: DataSource) {}

  async list(roundupId: number): Promise<RoundupEntry[]> {
    const roundup = await findRoundup(this.dataSource.manager, roundupId);
    return roundupEntries(this.dataSource.manager, roundup, new Date());
  }

  /**
   * Catalog products of the roundup's category and platform, not archived and not yet in it, whose latest
   * price in the band's region is inside the band (same currency, inclusive bounds). Cheapest first.
   */
  async suggestions(roundupId: number): Promise<RoundupSuggestions> {
    const manager = this.dataSource.manager;
    const roundup = await findRoundup(manager, roundupId);
    const now = new Date();
    const inRoundup = new Set(
      (await manager.getRepository(RoundupEntryEntity).find({ where: { roundupId }, select: { productId: true } })).map(
        (e) => e.productId,
      ),
    );
    const products = (
      await manager.getRepository(ProductEntity).find({
        where: { category: roundup.category, platform: roundup.platform, archivedAt: IsNull() },
      })
    ).filter((p) => !inRoundup.has(p.id));
    const prices = await priceHistoryByProduct(
      manager,
      products.map((p) => p.id),
      roundup.region,
    );
    const people = await loadPeople(
      manager,
      [...prices.values()].flat().map((p) => p.recordedBy),
    );
    const suggestions = products
      .map((product) => ({
        product: toProductBrief(product),
        priceCheck: priceCheckFor(roundup, prices.get(product.id) ?? [], people, now),
      }))
      .filter((s) => s.priceCheck.fit === 'in-band')
      .sort(
        (a, b) =>
          (a.priceCheck.latestPrice?.amountMinor ?? 0) - (b.priceCheck.latestPrice?.amountMinor ?? 0) ||
          a.product.maker.localeCompare(b.product.maker) ||
          a.product.model.localeCompare(b.product.model),
      );
    return {
      priceBand: {
        minMinor: roundup.priceMinMinor,
        maxMinor: roundup.priceMaxMinor,
        currency: roundup.currency,
        region: roundup.region,
      },
      suggestions,
    };
  }

  async referenceCandidates(roundupId: number): Promise<ReferenceCandidates> {
    const manager = this.dataSource.manager;
    await assertRoundupExists(manager, roundupId);
    const tested = await testedElsewhere(manager, roundupId);
    const inRoundup = new Set(
      (await manager.getRepository(RoundupEntryEntity).find({ where: { roundupId }, select: { productId: true } })).map(
        (e) => e.productId,
      ),
    );
    const ids = [...tested.keys()].filter((id) => !inRoundup.has(id));
    if (ids.length === 0) return [];
    const products = await manager.getRepository(ProductEntity).findBy({ id: In(ids) });
    return products
      .sort((a, b) => a.maker.localeCompare(b.maker) || a.model.localeCompare(b.model))
      .map((product) => ({
        product: toProductBrief(product),
        testedIn: (tested.get(product.id) ?? []).map(({ roundupId: id, title, state }) => ({
          roundupId: id,
          title,
          state,
        })),
      }));
  }

  /**
   * Adds a product. A tested entry gets one not-started cell per load configuration and a sample record; a
   * reference entry gets neither. The answer carries the price-band warnings (outside the band, no current
   * price, or a price in another currency, which is never converted).
   */
  async add(
    actor: CurrentUser,
    roundupId: number,
    input: ParsedAddRoundupEntryRequest,
  ): Promise<{ entry: RoundupEntry; warnings: string[] }> {
    try {
      return await this.dataSource.transaction(async (manager) => {
        const roundup = await lockRoundup(manager, roundupId);
        assertPlanEditable(roundup);
        const product = await manager.getRepository(ProductEntity).findOneBy({ id: input.productId });
        if (!product)
          throw invalid('That product is not in the catalog.', { productId: 'That product is not in the catalog.' });
        if (product.archivedAt) {
          throw invalid(`${productDisplayName(product)} is archived; restore it in the catalog first.`, {
            productId: 'This product is archived.',
          });
        }
        const entries = manager.getRepository(RoundupEntryEntity);
        if (await entries.existsBy({ roundupId, productId: product.id })) {
          throw conflict('entry_exists', `${productDisplayName(product)} is already in this roundup.`, {
            productId: 'Already in this roundup.',
          });
        }
        let referenceRoundupId: number | null = null;
        if (input.kind === 'reference') {
          const earlier = (await testedElsewhere(manager, roundupId, [product.id])).get(product.id) ?? [];
          if (earlier.length === 0) {
            throw new AppError(
              'no_earlier_results',
              422,
              `${productDisplayName(product)} has no accepted results in an earlier roundup, so it cannot be a reference entry. Add it to be tested instead.`,
              { kind: 'No earlier accepted results.' },
            );
          }
          const chosen = input.referenceRoundupId ?? earlier[0].roundupId;
          if (!earlier.some((e) => e.roundupId === chosen)) {
            throw invalid('That roundup has no accepted results for this product.', {
              referenceRoundupId: 'That roundup has no accepted results for this product.',
            });
          }
          referenceRoundupId = chosen;
        }
        const last = await entries.findOne({
          where: { roundupId },
          order: { position: 'DESC' },
          select: { position: true },
        });
        const { identifiers } = await entries.insert({
          roundupId,
          productId: product.id,
          kind: input.kind,
          referenceRoundupId,
          position: last ? last.position + 1 : 0,
          addedBy: actor.id,
        });
        const entryId = Number(identifiers[0].id);
        if (input.kind === 'tested') {
          const configs = await manager
            .getRepository(RoundupLoadConfigurationEntity)
            .find({ where: { roundupId }, order: { position: 'ASC' } });
          const now = new Date();
          if (configs.length > 0) {
            await manager.getRepository(MatrixCellEntity).insert(
              configs.map((c) => ({
                roundupId,
                entryId,
                loadConfigurationId: c.loadConfigurationId,
                state: 'not-started' as const,
                stateChangedAt: now,
              })),
            );
          }
          await manager.getRepository(SampleEntity).insert({ entryId, status: 'ordered' });
        }
        const entry = (await roundupEntries(manager, roundup, new Date())).find(
          (e) => e.id === entryId,
        ) as RoundupEntry;
        const warnings: string[] = [];
        if (entry.priceCheck.warning) warnings.push(entry.priceCheck.warning);
        if (input.kind === 'tested' && product.platform !== roundup.platform) {
          warnings.push(
            `${productDisplayName(product)} is a ${product.platform} product; this roundup covers ${roundup.platform}.`,
          );
        }
        await recordPlanChange(manager, actor, roundupId, 'roundup.entry_added', {
          entryId,
          productId: product.id,
          product: productDisplayName(product),
          kind: input.kind,
          referenceRoundupId,
          priceFit: entry.priceCheck.fit,
          warnings,
        });
        return { entry, warnings };
      });
    } catch (error) {
      if (isDuplicateKey(error)) throw conflict('entry_exists', 'This product is already in this roundup.');
      throw error;
    }
  }

  /** Removes an entry with its cells and sample, unless a cell already has work (running or beyond). */
  async remove(actor: CurrentUser, roundupId: number, entryId: number): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId);
      assertPlanEditable(roundup);
      const entry = await manager.getRepository(RoundupEntryEntity).findOneBy({ id: entryId, roundupId });
      if (!entry) throw notFound('That entry');
      const busy = await manager.getRepository(MatrixCellEntity).find({
        where: { entryId, state: In([...statesWithWork]) },
        lock: { mode: 'pessimistic_write' },
      });
      const product = await manager.getRepository(ProductEntity).findOneByOrFail({ id: entry.productId });
      if (busy.length > 0) {
        throw conflict(
          'entry_has_work',
          `${productDisplayName(product)} cannot leave the roundup: ${busy.length} of its cells are ${[...new Set(busy.map((c) => cellStateLabels[c.state].toLowerCase()))].join(' or ')}.`,
        );
      }
      await manager.getRepository(RoundupEntryEntity).delete({ id: entryId });
      await recordPlanChange(manager, actor, roundupId, 'roundup.entry_removed', {
        entryId,
        productId: entry.productId,
        product: productDisplayName(product),
        kind: entry.kind,
      });
    });
  }
}
