// Samples as the API sends them, with loan overdue flags computed by shared/domain rules.
import type { EntityManager } from 'typeorm';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import type { RoundupEntity } from '../entities/roundup.entity';
import { SampleEntity } from '../entities/sample.entity';
import { entriesWithProducts } from './product-fields';
import { isLoanOverdue, loanDaysOverdue } from '../../shared/domain/planning/loan-overdue';
import type { ProductBrief } from '../../shared/schemas/catalog';
import type { Sample } from '../../shared/schemas/samples';

export function toSampleDto(
  sample: SampleEntity,
  entry: RoundupEntryEntity,
  product: ProductBrief,
  timeZone: string,
  now: Date,
): Sample {
  const loan = { source: sample.source, status: sample.status, returnBy: sample.returnBy };
  return {
    id: sample.id,
    roundupId: entry.roundupId,
    entryId: entry.id,
    product,
    source: sample.source,
    orderReference: sample.orderReference,
    cost:
      sample.costMinor != null && sample.costCurrency
        ? { amountMinor: sample.costMinor, currency: sample.costCurrency }
        : null,
    vendorContact: sample.vendorContact,
    returnBy: sample.returnBy,
    receivedOn: sample.receivedOn,
    returnedOn: sample.returnedOn,
    serialNumber: sample.serialNumber,
    conditionNotes: sample.conditionNotes,
    firmwareOnArrival: sample.firmwareOnArrival,
    status: sample.status,
    overdue: isLoanOverdue(loan, timeZone, now),
    daysOverdue: loanDaysOverdue(loan, timeZone, now),
    updatedAt: sample.updatedAt.toISOString(),
  };
}

/** Samples of the given roundups with their entries and products, ready for DTOs. */
export async function samplesOfRoundups(
  manager: EntityManager,
  roundups: RoundupEntity[],
  now: Date,
  options: { onlyOpenLoans?: boolean } = {},
): Promise<Sample[]> {
  if (roundups.length === 0) return [];
  const byId = new Map(roundups.map((r) => [r.id, r]));
  const qb = manager
    .getRepository(SampleEntity)
    .createQueryBuilder('s')
    .innerJoin(RoundupEntryEntity, 'e', 'e.id = s.entryId')
    .where('e.roundupId IN (:...ids)', { ids: [...byId.keys()] })
    .orderBy('e.roundupId', 'ASC')
    .addOrderBy('e.position', 'ASC');
  if (options.onlyOpenLoans) {
    qb.andWhere("s.source = 'vendor-loan'")
      .andWhere("s.status NOT IN ('returned','kept')")
      .andWhere('s.returnBy IS NOT NULL');
  }
  const samples = await qb.getMany();
  if (samples.length === 0) return [];
  const { entryById, products } = await entriesWithProducts(manager, samples, (s) => s.entryId);
  return samples.map((sample) => {
    const entry = entryById.get(sample.entryId) as RoundupEntryEntity;
    const roundup = byId.get(entry.roundupId) as RoundupEntity;
    return toSampleDto(sample, entry, products.get(entry.productId) as ProductBrief, roundup.timeZone, now);
  });
}
