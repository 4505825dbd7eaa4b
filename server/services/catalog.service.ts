import { Brackets, type DataSource, type EntityManager } from 'typeorm';
import { ProductEntity } from '../entities/product.entity';
import { ProductPriceEntity } from '../entities/product-price.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { AppError, conflict, notFound } from '../errors';
import { recordAction } from './audit.service';
import { likeContains } from '../mappers/dto-values';
import { loadPeople } from '../mappers/people';
import {
  changedProductFields,
  latestPricesByProduct,
  priceHistoryByProduct,
  productColumnsFromInput,
  productInputFromEntity,
  toPriceDto,
  toProductDto,
} from '../mappers/product-fields';
import { isDuplicateKey } from '../lib/database-errors';
import {
  createProductRequestSchema,
  type Price,
  type Product,
  type ProductDetail,
  type ProductInput,
  type ProductList,
  type UpdateProductRequest,
  type ParsedProductListQuery,
  type ParsedCreatePriceRequest,
} from '../../shared/schemas/catalog';
import type { CurrentUser } from '../../shared/schemas/auth';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';

export const makerModelTaken = () =>
  conflict('product_exists', 'The catalog already has a product with this maker and model.', {
    model: 'The catalog already has a product with this maker and model.',
  });

const collator = new Intl.Collator('en', { sensitivity: 'base', numeric: true });

/** Catalog products and their price history. */
export class CatalogService {
  constructor(private readonly dataSource: DataSource) {}

  /**
   * Filters in SQL, then sorts and pages in memory: a review outlet's catalog is hundreds to a few thousand
   * boards, and sorting by the latest regional price needs the price rule applied first.
   */
  async list(query: ParsedProductListQuery): Promise<ProductList> {
    const manager = this.dataSource.manager;
    const qb = manager.getRepository(ProductEntity).createQueryBuilder('p');
    if (query.archived === 'exclude') qb.andWhere('p.archivedAt IS NULL');
    if (query.archived === 'only') qb.andWhere('p.archivedAt IS NOT NULL');
    if (query.maker) qb.andWhere('p.maker = :maker', { maker: query.maker });
    if (query.platform) qb.andWhere('p.platform = :platform', { platform: query.platform });
    if (query.socket) qb.andWhere('p.socket = :socket', { socket: query.socket });
    if (query.chipset) qb.andWhere('p.chipset = :chipset', { chipset: query.chipset });
    if (query.formFactor) qb.andWhere('p.formFactor = :formFactor', { formFactor: query.formFactor });
    if (query.vcoreStageType) qb.andWhere('p.vcoreStageType = :stageType', { stageType: query.vcoreStageType });
    if (query.minEffectivePhases != null) {
      qb.andWhere('p.effectivePhases >= :minPhases', { minPhases: query.minEffectivePhases });
    }
    if (query.search) {
      const term = likeContains(query.search);
      qb.andWhere(
        new Brackets((or) => {
          for (const column of ['maker', 'model', 'chipset', 'vrmController', 'vcoreStagePart']) {
            or.orWhere(`p.${column} LIKE :term`, { term });
          }
        }),
      );
    }
    const products = await qb.getMany();
    const latest = await latestPricesByProduct(manager);
    const people = await loadPeople(
      manager,
      [...latest.values()].flat().map((p) => p.recordedBy),
    );
    const dtos = products.map((product) =>
      toProductDto(
        product,
        (latest.get(product.id) ?? []).map((price) => toPriceDto(price, people)),
      ),
    );
    dtos.sort(productComparator(query));
    return {
      products: dtos.slice(query.offset, query.offset + query.limit),
      total: dtos.length,
      facets: await this.facets(manager),
    };
  }

  private async facets(manager: EntityManager): Promise<ProductList['facets']> {
    const distinct = async (column: string) => {
      const rows: { value: string }[] = await manager.query(
        `SELECT DISTINCT ${column} AS value FROM products WHERE archived_at IS NULL ORDER BY ${column}`,
      );
      return rows.map((row) => row.value);
    };
    const regions: { value: string }[] = await manager.query(
      'SELECT DISTINCT region AS value FROM product_prices ORDER BY region',
    );
    return {
      makers: await distinct('maker'),
      platforms: await distinct('platform'),
      sockets: await distinct('socket'),
      chipsets: await distinct('chipset'),
      regions: regions.map((row) => row.value),
    };
  }

  async get(id: number, manager: EntityManager = this.dataSource.manager): Promise<ProductDetail> {
    const product = await manager.getRepository(ProductEntity).findOneBy({ id });
    if (!product) throw notFound('That product');
    const history = (await priceHistoryByProduct(manager, [id])).get(id) ?? [];
    const latest = (await latestPricesByProduct(manager, [id])).get(id) ?? [];
    const people = await loadPeople(
      manager,
      history.map((p) => p.recordedBy),
    );
    const uses = await manager
      .getRepository(RoundupEntryEntity)
      .createQueryBuilder('e')
      .innerJoin(RoundupEntity, 'r', 'r.id = e.roundupId')
      .select(['e.roundupId AS roundupId', 'e.kind AS kind', 'r.title AS title', 'r.state AS state'])
      .where('e.productId = :id', { id })
      .orderBy('r.createdAt', 'DESC')
      .getRawMany<{ roundupId: number; kind: 'tested' | 'reference'; title: string; state: RoundupEntity['state'] }>();
    return {
      ...toProductDto(
        product,
        latest.map((price) => toPriceDto(price, people)),
      ),
      prices: history.map((price) => toPriceDto(price, people)),
      roundups: uses.map((use) => ({
        roundupId: Number(use.roundupId),
        title: use.title,
        state: use.state,
        kind: use.kind,
      })),
      deletable: uses.length === 0,
    };
  }

  async create(actor: CurrentUser, input: ProductInput): Promise<ProductDetail> {
    try {
      return await this.dataSource.transaction(async (manager) => {
        const repo = manager.getRepository(ProductEntity);
        const { identifiers } = await repo.insert({ ...productColumnsFromInput(input), createdBy: actor.id });
        const id = Number(identifiers[0].id);
        await recordAction(manager, actor, 'product.created', ['product', id], {
          maker: input.maker,
          model: input.model,
        });
        return this.get(id, manager);
      });
    } catch (error) {
      if (isDuplicateKey(error)) throw makerModelTaken();
      throw error;
    }
  }

  /** Partial update; the merged record is validated again (e.g. stages per phase against multiplication). */
  async update(actor: CurrentUser, id: number, input: UpdateProductRequest): Promise<ProductDetail> {
    try {
      return await this.dataSource.transaction(async (manager) => {
        const repo = manager.getRepository(ProductEntity);
        const product = await repo.findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
        if (!product) throw notFound('That product');
        const before = productInputFromEntity(product);
        const { archived, ...fields } = input;
        const parsed = createProductRequestSchema.safeParse({ ...before, ...fields });
        if (!parsed.success) {
          const problems: Record<string, string> = {};
          for (const issue of parsed.error.issues) problems[issue.path.join('.') || '_'] ??= issue.message;
          throw new AppError('validation_failed', 400, 'Some form values are not valid.', problems);
        }
        const changes = changedProductFields(before, parsed.data);
        const details: Record<string, unknown> = { changed: changes };
        if (changes.length > 0) await repo.update({ id }, productColumnsFromInput(parsed.data));
        if (archived !== undefined && archived !== (product.archivedAt != null)) {
          await repo.update({ id }, { archivedAt: archived ? new Date() : null });
          details.archived = archived;
        }
        if (changes.length > 0 || details.archived !== undefined) {
          const action =
            details.archived === true
              ? 'product.archived'
              : details.archived === false
                ? 'product.restored'
                : 'product.updated';
          await recordAction(manager, actor, action, ['product', id], details);
        }
        return this.get(id, manager);
      });
    } catch (error) {
      if (isDuplicateKey(error)) throw makerModelTaken();
      throw error;
    }
  }

  /** Deletes a product that no roundup uses; otherwise 409: archive it instead. */
  async remove(actor: CurrentUser, id: number): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const product = await manager
        .getRepository(ProductEntity)
        .findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!product) throw notFound('That product');
      const uses = await manager.getRepository(RoundupEntryEntity).countBy({ productId: id });
      if (uses > 0) {
        throw conflict(
          'product_in_use',
          `${productDisplayName(product)} is in ${uses} roundup${uses === 1 ? '' : 's'} and may have results, so it cannot be deleted. Archive it instead.`,
        );
      }
      await manager.getRepository(ProductEntity).delete({ id });
      await recordAction(manager, actor, 'product.deleted', ['product', id], {
        maker: product.maker,
        model: product.model,
      });
    });
  }

  async listPrices(productId: number, region?: string): Promise<Price[]> {
    const manager = this.dataSource.manager;
    if (!(await manager.getRepository(ProductEntity).existsBy({ id: productId }))) throw notFound('That product');
    const history = (await priceHistoryByProduct(manager, [productId], region)).get(productId) ?? [];
    const people = await loadPeople(
      manager,
      history.map((p) => p.recordedBy),
    );
    return history.map((price) => toPriceDto(price, people));
  }

  /** Adds a price to the history. Earlier prices stay; the latest-price rule decides which one counts. */
  async addPrice(actor: CurrentUser, productId: number, input: ParsedCreatePriceRequest): Promise<Price> {
    return this.dataSource.transaction(async (manager) => {
      const product = await manager.getRepository(ProductEntity).findOneBy({ id: productId });
      if (!product) throw notFound('That product');
      const repo = manager.getRepository(ProductPriceEntity);
      const { identifiers } = await repo.insert({
        productId,
        region: input.region,
        currency: input.currency,
        amountMinor: input.amountMinor,
        observedOn: input.observedOn,
        source: input.source,
        recordedBy: actor.id,
      });
      const price = await repo.findOneByOrFail({ id: Number(identifiers[0].id) });
      await recordAction(manager, actor, 'product.price_added', ['product', productId], {
        priceId: price.id,
        region: price.region,
        currency: price.currency,
        amountMinor: price.amountMinor,
        observedOn: price.observedOn,
      });
      return toPriceDto(price, await loadPeople(manager, [actor.id]));
    });
  }

  /** Removes a mistaken price entry (editors only); the audit log keeps what it was. */
  async removePrice(actor: CurrentUser, productId: number, priceId: number): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(ProductPriceEntity);
      const price = await repo.findOneBy({ id: priceId, productId });
      if (!price) throw notFound('That price');
      await repo.delete({ id: priceId });
      await recordAction(manager, actor, 'product.price_removed', ['product', productId], {
        priceId,
        region: price.region,
        currency: price.currency,
        amountMinor: price.amountMinor,
        observedOn: price.observedOn,
        source: price.source,
      });
    });
  }
}

function productComparator(query: ParsedProductListQuery): (a: Product, b: Product) => number {
  const direction = query.direction === 'desc' ? -1 : 1;
  const value = (product: Product): string | number | null => {
    switch (query.sort) {
      case 'maker':
        return `${product.maker}\u0000${product.model}`;
      case 'model':
        return product.model;
      case 'platform':
        return product.platform;
      case 'chipset':
        return product.chipset;
      case 'formFactor':
        return product.formFactor;
      case 'releaseDate':
        return product.releaseDate;
      case 'effectivePhases':
        return product.powerDesign.effectivePhases;
      case 'vcoreStageCurrentA':
        return product.powerDesign.vcoreStageCurrentA;
      case 'lanSpeedMbps':
        return product.features.lanSpeedMbps;
      case 'm2Slots':
        return product.features.m2Slots;
      case 'sataPorts':
        return product.features.sataPorts;
      case 'updatedAt':
        return product.updatedAt;
      case 'price': {
        const price = product.latestPrices.find((p) => p.region === query.priceRegion);
        return price ? price.amountMinor : null;
      }
    }
  };
  return (a, b) => {
    const va = value(a);
    const vb = value(b);
    // Unknown values sort last in both directions.
    if (va == null || vb == null) return va == null && vb == null ? a.id - b.id : va == null ? 1 : -1;
    const order = typeof va === 'number' && typeof vb === 'number' ? va - vb : collator.compare(String(va), String(vb));
    return order !== 0 ? order * direction : a.id - b.id;
  };
}
