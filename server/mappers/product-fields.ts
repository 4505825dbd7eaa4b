import { In, type EntityManager } from 'typeorm';
import { ProductEntity } from '../entities/product.entity';
import { ProductPriceEntity } from '../entities/product-price.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { rowsById } from '../lib/rows-by-id';
import { booleanOrNull, decimalOrNull, isoOrNull } from './dto-values';
import { personOrNull } from './people';
import {
  effectivePhaseCount,
  vcoreRatedCurrentA,
  vcoreStageCount,
  type PhaseMultiplication,
} from '../../shared/domain/planning/power-design';
import type {
  FormFactor,
  FrontUsbCHeader,
  Price,
  Product,
  ProductBrief,
  ProductCategory,
  ProductInput,
  VcoreStageType,
  WifiGeneration,
} from '../../shared/schemas/catalog';
import type { PersonRef } from '../../shared/schemas/planning-fields';

type ProductColumns = Omit<ProductEntity, 'id' | 'archivedAt' | 'createdBy' | 'createdAt' | 'updatedAt'>;

/** Entity columns from a validated product input, with the effective phase count computed. */
export function productColumnsFromInput(input: ProductInput): ProductColumns {
  const design = input.powerDesign;
  const features = input.features;
  return {
    maker: input.maker,
    model: input.model,
    category: input.category,
    platform: input.platform,
    socket: input.socket,
    chipset: input.chipset,
    formFactor: input.formFactor,
    releaseDate: input.releaseDate,
    vrmController: design.controller,
    controllerPhases: design.controllerPhases,
    phaseMultiplication: design.phaseMultiplication,
    stagesPerPhase: design.stagesPerPhase,
    effectivePhases:
      design.controllerPhases && design.phaseMultiplication
        ? effectivePhaseCount(design.controllerPhases, design.phaseMultiplication)
        : null,
    vcoreStageType: design.vcoreStageType,
    vcoreStagePart: design.vcoreStagePart,
    vcoreStageCurrentA: design.vcoreStageCurrentA == null ? null : design.vcoreStageCurrentA.toFixed(1),
    socRailStages: design.socRailStages,
    otherRails: design.otherRails,
    heatsinkNotes: design.heatsinkNotes,
    rearUsb2: features.rearUsb.usb2,
    rearUsb5g: features.rearUsb.usb5g,
    rearUsb10g: features.rearUsb.usb10g,
    rearUsb20g: features.rearUsb.usb20g,
    rearUsb40g: features.rearUsb.usb40g,
    frontUsbCHeader: features.frontUsbCHeader,
    lanSpeedMbps: features.lanSpeedMbps,
    wifi: features.wifi,
    m2Slots: features.m2Slots,
    sataPorts: features.sataPorts,
    audio: features.audio,
    ioShieldPrefitted: features.ioShieldPrefitted,
  };
}

/** The stored product as a full input (for comparing an import row with what is stored). */
export function productInputFromEntity(product: ProductEntity): ProductInput {
  return {
    maker: product.maker,
    model: product.model,
    category: product.category as ProductCategory,
    platform: product.platform,
    socket: product.socket,
    chipset: product.chipset,
    formFactor: product.formFactor as FormFactor,
    releaseDate: product.releaseDate,
    powerDesign: {
      controller: product.vrmController,
      controllerPhases: product.controllerPhases,
      phaseMultiplication: product.phaseMultiplication as PhaseMultiplication | null,
      stagesPerPhase: product.stagesPerPhase,
      vcoreStageType: product.vcoreStageType as VcoreStageType | null,
      vcoreStagePart: product.vcoreStagePart,
      vcoreStageCurrentA: decimalOrNull(product.vcoreStageCurrentA),
      socRailStages: product.socRailStages,
      otherRails: product.otherRails,
      heatsinkNotes: product.heatsinkNotes,
    },
    features: {
      rearUsb: {
        usb2: product.rearUsb2,
        usb5g: product.rearUsb5g,
        usb10g: product.rearUsb10g,
        usb20g: product.rearUsb20g,
        usb40g: product.rearUsb40g,
      },
      frontUsbCHeader: product.frontUsbCHeader as FrontUsbCHeader | null,
      lanSpeedMbps: product.lanSpeedMbps,
      wifi: product.wifi as WifiGeneration | null,
      m2Slots: product.m2Slots,
      sataPorts: product.sataPorts,
      audio: product.audio,
      ioShieldPrefitted: booleanOrNull(product.ioShieldPrefitted),
    },
  };
}

/** Dotted paths of the fields whose values differ, e.g. ['chipset', 'powerDesign.controllerPhases']. */
export function changedProductFields(before: ProductInput, after: ProductInput): string[] {
  const changed: string[] = [];
  const walk = (a: unknown, b: unknown, path: string) => {
    if (a !== null && b !== null && typeof a === 'object' && typeof b === 'object') {
      for (const key of Object.keys(b as object)) {
        walk((a as Record<string, unknown>)[key], (b as Record<string, unknown>)[key], path ? `${path}.${key}` : key);
      }
    } else if ((a ?? null) !== (b ?? null)) {
      changed.push(path);
    }
  };
  walk(before, after, '');
  return changed;
}

export function toPriceDto(price: ProductPriceEntity, people: Map<number, PersonRef>): Price {
  return {
    id: price.id,
    productId: price.productId,
    region: price.region,
    currency: price.currency,
    amountMinor: price.amountMinor,
    observedOn: price.observedOn,
    source: price.source,
    recordedBy: personOrNull(people, price.recordedBy),
    recordedAt: price.createdAt.toISOString(),
  };
}

export function toProductDto(product: ProductEntity, latestPrices: Price[]): Product {
  const { powerDesign: design, features, ...identity } = productInputFromEntity(product);
  const stageCount =
    design.controllerPhases && design.phaseMultiplication && design.stagesPerPhase
      ? vcoreStageCount(design.controllerPhases, design.phaseMultiplication, design.stagesPerPhase)
      : null;
  return {
    id: product.id,
    ...identity,
    powerDesign: {
      controller: design.controller,
      controllerPhases: design.controllerPhases,
      phaseMultiplication: design.phaseMultiplication,
      stagesPerPhase: design.stagesPerPhase,
      effectivePhases: product.effectivePhases,
      vcoreStageCount: stageCount,
      vcoreStageType: design.vcoreStageType,
      vcoreStagePart: design.vcoreStagePart,
      vcoreStageCurrentA: design.vcoreStageCurrentA,
      vcoreRatedCurrentA:
        stageCount != null && design.vcoreStageCurrentA != null
          ? vcoreRatedCurrentA(stageCount, design.vcoreStageCurrentA)
          : null,
      socRailStages: design.socRailStages,
      otherRails: design.otherRails,
      heatsinkNotes: design.heatsinkNotes,
    },
    features,
    archived: product.archivedAt != null,
    archivedAt: isoOrNull(product.archivedAt),
    latestPrices,
    createdAt: product.createdAt.toISOString(),
    updatedAt: product.updatedAt.toISOString(),
  };
}

export function toProductBrief(product: ProductEntity): ProductBrief {
  return {
    id: product.id,
    maker: product.maker,
    model: product.model,
    chipset: product.chipset,
    formFactor: product.formFactor as FormFactor,
    archived: product.archivedAt != null,
  };
}

/**
 * The latest price per product and region (latest observation date, then the later record), for the given
 * products, or for the whole catalog when `productIds` is omitted. Grouped by product id.
 */
export async function latestPricesByProduct(
  manager: EntityManager,
  productIds?: number[],
  region?: string,
): Promise<Map<number, ProductPriceEntity[]>> {
  const grouped = new Map<number, ProductPriceEntity[]>();
  if (productIds && productIds.length === 0) return grouped;
  const where: string[] = [];
  const parameters: unknown[] = [];
  if (productIds) {
    where.push(`product_id IN (${productIds.map(() => '?').join(',')})`);
    parameters.push(...productIds);
  }
  if (region) {
    where.push('region = ?');
    parameters.push(region);
  }
  const rows: { id: number }[] = await manager.query(
    `SELECT id FROM (
       SELECT id, ROW_NUMBER() OVER (PARTITION BY product_id, region ORDER BY observed_on DESC, id DESC) AS rank_in_region
       FROM product_prices ${where.length ? `WHERE ${where.join(' AND ')}` : ''}
     ) ranked WHERE rank_in_region = 1`,
    parameters,
  );
  if (rows.length === 0) return grouped;
  const prices = await manager
    .getRepository(ProductPriceEntity)
    .find({ where: { id: In(rows.map((row) => Number(row.id))) }, order: { region: 'ASC' } });
  for (const price of prices) {
    const list = grouped.get(price.productId) ?? [];
    list.push(price);
    grouped.set(price.productId, list);
  }
  return grouped;
}

/** All prices of the given products (history), grouped by product id, newest first. */
export async function priceHistoryByProduct(
  manager: EntityManager,
  productIds: number[],
  region?: string,
): Promise<Map<number, ProductPriceEntity[]>> {
  const grouped = new Map<number, ProductPriceEntity[]>();
  if (productIds.length === 0) return grouped;
  const prices = await manager.getRepository(ProductPriceEntity).find({
    where: { productId: In(productIds), ...(region ? { region } : {}) },
    order: { observedOn: 'DESC', id: 'DESC' },
  });
  for (const price of prices) {
    const list = grouped.get(price.productId) ?? [];
    list.push(price);
    grouped.set(price.productId, list);
  }
  return grouped;
}

export async function productBriefs(manager: EntityManager, ids: number[]): Promise<Map<number, ProductBrief>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const products = await manager.getRepository(ProductEntity).findBy({ id: In(unique) });
  return new Map(products.map((p) => [p.id, toProductBrief(p)]));
}

/** The roundup entries that `items` refer to, by key, and the brief of each one's product by product key. */
export async function entriesWithProducts<T>(
  manager: EntityManager,
  items: readonly T[],
  entryIdOf: (item: T) => number,
) {
  const entryById = await rowsById(manager, RoundupEntryEntity, items, entryIdOf);
  const products = await productBriefs(
    manager,
    [...entryById.values()].map((e) => e.productId),
  );
  return { entryById, products };
}
