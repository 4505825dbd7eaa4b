import { In, type EntityManager } from 'typeorm';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { PhotoEntity } from '../entities/photo.entity';
import { ProductEntity } from '../entities/product.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import type { TestRunsService } from '../services/test-runs.service';
import type { LiveBlockContent, LiveBlockResolver, PhotoContent } from './render-write-up';
import {
  phaseMultiplicationLabels,
  vcoreRatedCurrentA,
  vcoreStageCount,
  type PhaseMultiplication,
} from '../../shared/domain/planning/power-design';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import type { LiveBlockKind } from '../../shared/schemas/write-up-document';

const thin = '\u2009';
const celsius = (value: number | null) => (value === null ? '—' : `${value.toFixed(1)}${thin}°C`);

/** Where a photo's web sizes are served: staff pages use the signed-in addresses; the reader site passes its own. */
export type PhotoAddress = (photoId: number, width: number, format: 'webp' | 'jpeg') => string;
export const staffPhotoAddress: PhotoAddress = (photoId, width, format) =>
  `/api/photos/${photoId}/files/${width}.${format}`;

export interface WriteUpLiveData extends LiveBlockResolver {
  /** The tested products of the roundup, in the roundup's order. */
  entries: { entryId: number; productName: string }[];
  photos: PhotoEntity[];
  productNameOf(entryId: number): string;
}

function powerDesignRows(product: ProductEntity): { label: string; value: string }[] {
  const rows: { label: string; value: string }[] = [];
  const multiplication = product.phaseMultiplication as PhaseMultiplication | null;
  if (product.vrmController || product.controllerPhases) {
    const phases = product.controllerPhases ? `, ${product.controllerPhases} controller phases` : '';
    rows.push({ label: 'V-core controller', value: `${product.vrmController ?? 'Not recorded'}${phases}` });
  }
  if (multiplication && phaseMultiplicationLabels[multiplication]) {
    const effective = product.effectivePhases ? `: ${product.effectivePhases} effective phases` : '';
    rows.push({ label: 'Phase layout', value: `${phaseMultiplicationLabels[multiplication]}${effective}` });
  }
  const stageCurrent = product.vcoreStageCurrentA === null ? null : Number(product.vcoreStageCurrentA);
  if (product.controllerPhases && multiplication && product.stagesPerPhase) {
    const count = vcoreStageCount(product.controllerPhases, multiplication, product.stagesPerPhase);
    const part = [product.vcoreStageType, product.vcoreStagePart].filter(Boolean).join(' ') || 'power stages';
    const rating = stageCurrent ? `, ${stageCurrent}${thin}A each` : '';
    rows.push({ label: 'V-core stages', value: `${count} × ${part}${rating}` });
    if (stageCurrent) {
      rows.push({
        label: 'Rated V-core current',
        value: `${vcoreRatedCurrentA(count, stageCurrent)}${thin}A (sum of the stages’ ratings, not what the board can cool)`,
      });
    }
  }
  if (product.socRailStages !== null) rows.push({ label: 'SoC rail stages', value: String(product.socRailStages) });
  if (product.otherRails) rows.push({ label: 'Other rails', value: product.otherRails });
  if (product.heatsinkNotes) rows.push({ label: 'Heatsinks', value: product.heatsinkNotes });
  if (rows.length === 0) rows.push({ label: 'Power design', value: 'Not recorded in the catalog yet.' });
  return rows;
}

/**
 * The current data a roundup's write-up shows in its live blocks and photos, loaded once per render. Results come
 * from the test-runs service (the run of record per cell, or the latest run while none is chosen).
 */
export async function loadWriteUpLiveData(
  manager: EntityManager,
  testRuns: TestRunsService,
  roundupId: number,
  photoAddress: PhotoAddress = staffPhotoAddress,
): Promise<WriteUpLiveData> {
  const entries = await manager
    .getRepository(RoundupEntryEntity)
    .find({ where: { roundupId, kind: 'tested' }, order: { position: 'ASC', id: 'ASC' } });
  const products = await manager.getRepository(ProductEntity).findBy({ id: In(entries.map((e) => e.productId)) });
  const productById = new Map(products.map((p) => [p.id, p]));
  const productOfEntry = new Map(entries.map((e) => [e.id, productById.get(e.productId) ?? null]));
  const links = await manager
    .getRepository(RoundupLoadConfigurationEntity)
    .find({ where: { roundupId }, order: { position: 'ASC' } });
  const configs = await manager
    .getRepository(LoadConfigurationEntity)
    .findBy({ id: In(links.map((l) => l.loadConfigurationId)) });
  const configById = new Map(configs.map((c) => [c.id, c]));
  const results = await testRuns.results(roundupId);
  const photos = await manager
    .getRepository(PhotoEntity)
    .find({ where: { roundupId }, order: { entryId: 'ASC', position: 'ASC', id: 'ASC' } });
  const photoById = new Map(photos.map((p) => [p.id, p]));

  const productNameOf = (entryId: number) => {
    const product = productOfEntry.get(entryId);
    return product ? productDisplayName(product) : 'A product no longer in this roundup';
  };

  const liveBlock = (ref: { block: LiveBlockKind; entryId: number }): LiveBlockContent | null => {
    const product = productOfEntry.get(ref.entryId);
    if (!product) return null;
    const productName = productDisplayName(product);
    if (ref.block === 'power-design') return { block: 'power-design', productName, rows: powerDesignRows(product) };
    let manual = false;
    let notOfRecord = false;
    const rows = links.flatMap((link) => {
      const config = configById.get(link.loadConfigurationId);
      if (!config) return [];
      const cell = results.cells.find((c) => c.entryId === ref.entryId && c.loadConfigurationId === config.id);
      const power = `${Number(config.expectedPackagePowerW).toFixed(1)}${thin}W`;
      if (!cell || cell.runId === null) return [[config.name, power, '—', '—', 'Not measured']];
      if (cell.source === 'manual') manual = true;
      if (!cell.isRunOfRecord) notOfRecord = true;
      const verdict = cell.verdictLabel ?? (cell.verdict ? cell.verdict : '—');
      const throttled = cell.throttled && !/throttl/i.test(verdict) ? `${verdict} (throttled)` : verdict;
      const peak = `${celsius(cell.peakC)}${cell.source === 'manual' ? ' *' : ''}`;
      return [[config.name, power, peak, celsius(cell.deltaOverAmbientC), throttled]];
    });
    const notes: string[] = [];
    if (manual) notes.push('* Entered by hand from the bench notes, not read from a logger file.');
    if (notOfRecord) notes.push('Some rows show the latest run: no run of record has been chosen for them yet.');
    return {
      block: 'results',
      productName,
      caption: `${productName}: hottest V-core reading per load configuration`,
      columns: ['Load configuration', 'Package power', 'Peak', 'Over ambient', 'Verdict'],
      rows,
      footnote: notes.length > 0 ? notes.join(' ') : undefined,
    };
  };

  const photo = (photoId: number): PhotoContent | null => {
    const row = photoById.get(photoId);
    if (!row) return null;
    const webp = row.derivatives.filter((d) => d.format === 'webp').sort((a, b) => a.width - b.width);
    const middle = webp.find((d) => d.width >= 960) ?? webp.at(-1);
    if (!middle) return null;
    return {
      src: photoAddress(row.id, middle.width, 'webp'),
      srcset: webp.map((d) => `${photoAddress(row.id, d.width, 'webp')} ${d.width}w`).join(', '),
      width: middle.width,
      height: middle.height,
      altText: row.altText,
      caption: row.caption,
    };
  };

  return {
    entries: entries.map((entry) => ({ entryId: entry.id, productName: productNameOf(entry.id) })),
    photos,
    productNameOf,
    liveBlock,
    photo,
  };
}
