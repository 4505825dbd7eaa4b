// A roundup's entries as the API sends them, each with its price check against the roundup's band.
import { In, type EntityManager } from 'typeorm';
import type { ProductPriceEntity } from '../entities/product-price.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { SampleEntity } from '../entities/sample.entity';
import { loadPeople, personOrNull } from './people';
import { priceHistoryByProduct, productBriefs, toPriceDto } from './product-fields';
import { bandOf, roundupToday } from './roundup';
import { toSampleDto } from './sample';
import { checkPriceAgainstBand } from '../../shared/domain/planning/price-band';
import type { ProductBrief } from '../../shared/schemas/catalog';
import type { PersonRef } from '../../shared/schemas/planning-fields';
import type { PriceCheck, RoundupEntry } from '../../shared/schemas/roundups';

/** Price check of one product's regional price history against the roundup's band. */
export function priceCheckFor(
  roundup: RoundupEntity,
  prices: ProductPriceEntity[],
  people: Map<number, PersonRef>,
  now: Date,
): PriceCheck {
  const check = checkPriceAgainstBand(bandOf(roundup), prices, roundupToday(roundup, now));
  const latest = check.latestPrice ? prices.find((p) => p.id === check.latestPrice?.id) : undefined;
  return {
    fit: check.fit,
    latestPrice: latest ? toPriceDto(latest, people) : null,
    stale: check.stale,
    warning: check.warning,
  };
}

/** Reference entries are shown for comparison only: the band does not apply to them, so they carry no warning. */
function referencePriceCheck(entry: RoundupEntryEntity, check: PriceCheck): PriceCheck {
  return entry.kind === 'reference' ? { ...check, warning: null } : check;
}

/** A roundup's entries in order, each with its price check, sample and reference roundup. */
export async function roundupEntries(
  manager: EntityManager,
  roundup: RoundupEntity,
  now: Date,
): Promise<RoundupEntry[]> {
  const entries = await manager
    .getRepository(RoundupEntryEntity)
    .find({ where: { roundupId: roundup.id }, order: { position: 'ASC', id: 'ASC' } });
  if (entries.length === 0) return [];
  const productIds = entries.map((e) => e.productId);
  const products = await productBriefs(manager, productIds);
  const prices = await priceHistoryByProduct(manager, productIds, roundup.region);
  const samples = await manager.getRepository(SampleEntity).findBy({ entryId: In(entries.map((e) => e.id)) });
  const sampleByEntry = new Map(samples.map((s) => [s.entryId, s]));
  const referenceIds = entries.map((e) => e.referenceRoundupId).filter((id): id is number => id != null);
  const references = referenceIds.length
    ? await manager
        .getRepository(RoundupEntity)
        .find({ where: { id: In(referenceIds) }, select: { id: true, title: true } })
    : [];
  const referenceById = new Map(references.map((r) => [r.id, r]));
  const people = await loadPeople(manager, [
    ...entries.map((e) => e.addedBy),
    ...[...prices.values()].flat().map((p) => p.recordedBy),
  ]);
  return entries.map((entry) => {
    const product = products.get(entry.productId) as ProductBrief;
    const sample = sampleByEntry.get(entry.id);
    const reference = entry.referenceRoundupId != null ? referenceById.get(entry.referenceRoundupId) : undefined;
    return {
      id: entry.id,
      kind: entry.kind,
      position: entry.position,
      product,
      priceCheck: referencePriceCheck(entry, priceCheckFor(roundup, prices.get(entry.productId) ?? [], people, now)),
      referenceRoundup: reference ? { id: reference.id, title: reference.title } : null,
      sample: sample ? toSampleDto(sample, entry, product, roundup.timeZone, now) : null,
      addedBy: personOrNull(people, entry.addedBy),
      addedAt: entry.createdAt.toISOString(),
    };
  });
}
