import { createHash } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { ProductEntity } from '../entities/product.entity';
import { ProductPriceEntity } from '../entities/product-price.entity';
import { AppError, conflict } from '../errors';
import { recordAction } from './audit.service';
import { parseCatalogCsv } from '../lib/catalog-csv';
import { changedProductFields, productColumnsFromInput, productInputFromEntity } from '../mappers/product-fields';
import { isDuplicateKey } from '../lib/database-errors';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import type {
  CatalogImportPreview,
  CatalogImportResult,
  ImportRowError,
  ImportRowPreview,
} from '../../shared/schemas/catalog-import';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { ProductInput } from '../../shared/schemas/catalog';

export function csvChecksum(csv: string): string {
  return createHash('sha256').update(csv, 'utf8').digest('hex');
}

const makerModelKey = (maker: string, model: string) =>
  `${maker.trim().toLowerCase()}\u0000${model.trim().toLowerCase()}`;

interface PlannedRow {
  preview: ImportRowPreview;
  product: ProductInput | null;
}

/**
 * CSV import in two steps. Preview parses and checks every row against the catalog and saves nothing.
 * Commit takes the same text back with the preview's checksum, checks everything again inside one
 * transaction and saves all rows or none.
 */
export class CatalogImportService {
  constructor(private readonly dataSource: DataSource) {}

  async preview(csv: string): Promise<CatalogImportPreview> {
    const { preview } = await this.plan(this.dataSource.manager, csv);
    return preview;
  }

  async commit(actor: CurrentUser, csv: string, checksum: string): Promise<CatalogImportResult> {
    if (csvChecksum(csv) !== checksum) {
      throw conflict('import_changed', 'This file is not the one you previewed. Preview it again before importing.');
    }
    try {
      return await this.dataSource.transaction(async (manager) => {
        // Lock the catalog's rows for the length of the import so a concurrent edit cannot slip between
        // the check and the write.
        await manager.query('SELECT id FROM products FOR UPDATE');
        const { preview, planned } = await this.plan(manager, csv);
        if (!preview.canCommit) {
          const fields: Record<string, string> = {};
          for (const error of preview.errors)
            fields[`row ${error.rowNumber}${error.column ? ` ${error.column}` : ''}`] ??= error.message;
          throw new AppError(
            'import_has_errors',
            422,
            `The file has ${preview.errors.length} problem${preview.errors.length === 1 ? '' : 's'}; nothing was imported.`,
            fields,
          );
        }
        const result: CatalogImportResult = { created: 0, updated: 0, unchanged: 0, pricesAdded: 0, productIds: [] };
        const products = manager.getRepository(ProductEntity);
        const prices = manager.getRepository(ProductPriceEntity);
        for (const { preview: row, product } of planned) {
          if (!product) continue;
          let productId = row.productId;
          if (row.action === 'create') {
            const { identifiers } = await products.insert({ ...productColumnsFromInput(product), createdBy: actor.id });
            productId = Number(identifiers[0].id);
            result.created++;
          } else if (row.changedFields.length > 0) {
            await products.update({ id: productId as number }, productColumnsFromInput(product));
            result.updated++;
          } else {
            result.unchanged++;
          }
          if (row.price && row.price.action === 'add') {
            const { action: _action, ...price } = row.price;
            await prices.insert({ ...price, productId: productId as number, recordedBy: actor.id });
            result.pricesAdded++;
          }
          result.productIds.push(productId as number);
        }
        await recordAction(manager, actor, 'catalog.imported', ['catalog', null], {
          checksum,
          created: result.created,
          updated: result.updated,
          pricesAdded: result.pricesAdded,
        });
        return result;
      });
    } catch (error) {
      if (isDuplicateKey(error)) {
        throw conflict('import_conflict', 'Someone changed the catalog while importing. Preview the file again.');
      }
      throw error;
    }
  }

  private async plan(
    manager: EntityManager,
    csv: string,
  ): Promise<{ preview: CatalogImportPreview; planned: PlannedRow[] }> {
    const parsed = parseCatalogCsv(csv);
    const existing = new Map<string, ProductEntity>();
    for (const product of await manager.getRepository(ProductEntity).find()) {
      existing.set(makerModelKey(product.maker, product.model), product);
    }
    const priceKeys = new Set<string>();
    const priceKey = (
      productId: number | string,
      p: { region: string; currency: string; amountMinor: number; observedOn: string },
    ) => `${productId}|${p.region}|${p.currency}|${p.amountMinor}|${p.observedOn}`;
    const storedPrices: {
      product_id: number;
      region: string;
      currency: string;
      amount_minor: number;
      observed_on: string;
    }[] = await manager.query(
      "SELECT product_id, region, currency, amount_minor, DATE_FORMAT(observed_on, '%Y-%m-%d') AS observed_on FROM product_prices",
    );
    for (const p of storedPrices) {
      priceKeys.add(
        priceKey(Number(p.product_id), {
          region: p.region,
          currency: p.currency,
          amountMinor: Number(p.amount_minor),
          observedOn: p.observed_on,
        }),
      );
    }

    const firstRowFor = new Map<string, number>();
    const planned: PlannedRow[] = parsed.rows.map((row) => {
      const errors: ImportRowError[] = [...row.errors];
      const key = makerModelKey(row.maker, row.model);
      const stored = existing.get(key) ?? null;
      const earlier = firstRowFor.get(key);
      if (row.maker && row.model) {
        if (earlier !== undefined) {
          errors.push({
            rowNumber: row.rowNumber,
            column: 'model',
            message: `Row ${earlier} already has ${productDisplayName(row)}; each product once per file.`,
          });
        } else {
          firstRowFor.set(key, row.rowNumber);
        }
      }
      const product = errors.length === 0 ? row.product : null;
      const changedFields = stored && product ? changedProductFields(productInputFromEntity(stored), product) : [];
      let price: ImportRowPreview['price'] = null;
      if (row.price) {
        // A new product's price cannot be in the history yet, except twice in this file.
        const id = stored ? stored.id : `new:${key}`;
        const k = priceKey(id, row.price);
        price = { ...row.price, action: priceKeys.has(k) ? 'duplicate' : 'add' };
        priceKeys.add(k);
      }
      return {
        product,
        preview: {
          rowNumber: row.rowNumber,
          maker: row.maker,
          model: row.model,
          action: stored ? 'update' : 'create',
          productId: stored ? stored.id : null,
          changedFields,
          price: errors.length === 0 ? price : null,
          errors,
        },
      };
    });
    const errors = [...parsed.fileErrors, ...planned.flatMap((p) => p.preview.errors)];
    const validRowCount = planned.filter((p) => p.preview.errors.length === 0).length;
    return {
      planned,
      preview: {
        checksum: csvChecksum(csv),
        rowCount: planned.length,
        validRowCount,
        errors,
        ignoredColumns: parsed.ignoredColumns,
        rows: planned.map((p) => p.preview),
        canCommit: errors.length === 0 && planned.length > 0,
      },
    };
  }
}
