import type { DataSource } from 'typeorm';
import { ProductEntity } from '../entities/product.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { SampleEntity } from '../entities/sample.entity';
import { AppError, notFound } from '../errors';
import { toProductBrief } from '../mappers/product-fields';
import { recordPlanChange } from '../lib/roundup-audit';
import { findRoundup } from '../lib/roundup-access';
import { samplesOfRoundups, toSampleDto } from '../mappers/sample';
import type { CurrentUser } from '../../shared/schemas/auth';
import { sampleDateOrderProblems, type Sample, type ParsedUpdateSampleRequest } from '../../shared/schemas/samples';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';

const editableFields = [
  'source',
  'orderReference',
  'costMinor',
  'costCurrency',
  'vendorContact',
  'returnBy',
  'receivedOn',
  'returnedOn',
  'serialNumber',
  'conditionNotes',
  'firmwareOnArrival',
  'status',
] as const;
type EditableField = (typeof editableFields)[number];
type SampleFields = Pick<SampleEntity, EditableField>;

const receivedStatuses = new Set(['received', 'on-the-bench', 'tested', 'returned', 'kept']);

/**
 * Problems with a sample record as a whole, by field. Switching the source clears the other source's fields
 * (done by the caller before this check).
 */
export function sampleProblems(sample: SampleFields): Record<string, string> {
  const problems: Record<string, string> = {};
  if (sample.source === 'retail') {
    if (!sample.orderReference) problems.orderReference = 'A retail purchase needs its order reference.';
    if (sample.costMinor == null) problems.costMinor = 'A retail purchase needs its cost.';
  }
  if (sample.source === 'vendor-loan') {
    if (!sample.vendorContact) problems.vendorContact = 'A vendor loan needs the vendor contact.';
    if (!sample.returnBy) problems.returnBy = 'A vendor loan needs its return-by date.';
  }
  if ((sample.costMinor == null) !== (sample.costCurrency == null)) {
    problems[sample.costMinor == null ? 'costMinor' : 'costCurrency'] = 'Give the cost with its currency.';
  }
  if (receivedStatuses.has(sample.status)) {
    if (!sample.source) problems.source = 'Say whether the sample was bought or lent before marking it received.';
    if (!sample.receivedOn) problems.receivedOn = 'Enter the date the sample arrived.';
  }
  if (sample.status === 'returned' && !sample.returnedOn) problems.returnedOn = 'Enter the date it went back.';
  if (sample.status !== 'returned' && sample.returnedOn)
    problems.returnedOn = 'Only a returned sample has a returned date.';
  Object.assign(problems, sampleDateOrderProblems(sample));
  return problems;
}

export class SamplesService {
  constructor(private readonly dataSource: DataSource) {}

  async list(roundupId: number): Promise<{ timeZone: string; samples: Sample[] }> {
    const roundup = await findRoundup(this.dataSource.manager, roundupId);
    return {
      timeZone: roundup.timeZone,
      samples: await samplesOfRoundups(this.dataSource.manager, [roundup], new Date()),
    };
  }

  async update(
    actor: CurrentUser,
    roundupId: number,
    sampleId: number,
    input: ParsedUpdateSampleRequest,
  ): Promise<Sample> {
    return this.dataSource.transaction(async (manager) => {
      const roundup = await findRoundup(manager, roundupId);
      const repo = manager.getRepository(SampleEntity);
      const sample = await repo.findOne({ where: { id: sampleId }, lock: { mode: 'pessimistic_write' } });
      const entry = sample ? await manager.getRepository(RoundupEntryEntity).findOneBy({ id: sample.entryId }) : null;
      if (!sample || !entry || entry.roundupId !== roundupId) throw notFound('That sample');

      const merged: SampleFields = { ...sample };
      for (const key of editableFields) {
        if (input[key] !== undefined) (merged as Record<string, unknown>)[key] = input[key];
      }
      if (input.source !== undefined && input.source !== sample.source) {
        if (merged.source !== 'retail')
          Object.assign(merged, { orderReference: null, costMinor: null, costCurrency: null });
        if (merged.source !== 'vendor-loan') Object.assign(merged, { vendorContact: null, returnBy: null });
      }
      const problems = sampleProblems(merged);
      if (Object.keys(problems).length > 0) {
        throw new AppError('validation_failed', 422, Object.values(problems)[0], problems);
      }
      const changes: Record<string, { from: unknown; to: unknown }> = {};
      for (const key of editableFields) {
        if (merged[key] !== sample[key]) changes[key] = { from: sample[key], to: merged[key] };
      }
      if (Object.keys(changes).length > 0) {
        await repo.update(
          { id: sampleId },
          Object.fromEntries(Object.keys(changes).map((k) => [k, merged[k as EditableField]])),
        );
        const product = await manager.getRepository(ProductEntity).findOneByOrFail({ id: entry.productId });
        await recordPlanChange(manager, actor, roundupId, 'roundup.sample_updated', {
          sampleId,
          product: productDisplayName(product),
          changes,
        });
      }
      const saved = await repo.findOneByOrFail({ id: sampleId });
      const product = await manager.getRepository(ProductEntity).findOneByOrFail({ id: entry.productId });
      return toSampleDto(saved, entry, toProductBrief(product), roundup.timeZone, new Date());
    });
  }
}
