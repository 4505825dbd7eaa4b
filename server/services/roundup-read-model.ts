// Builds the roundup DTOs the API sends (summaries, entries, matrix cells, samples, queue items) from rows,
// with the derived facts — price checks, progress, overdue flags — computed by shared/domain rules.
import { In, type EntityManager } from 'typeorm';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { ProductEntity } from '../entities/product.entity';
import { ProductPriceEntity } from '../entities/product-price.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { SampleEntity } from '../entities/sample.entity';
import { loadPeople, personOrNull } from '../mappers/people';
import { priceHistoryByProduct, toPriceDto, toProductBrief } from '../mappers/product-fields';
import { availableCellActions, cellStates, type CellState } from '../../shared/domain/planning/matrix-cell-states';
import {
  calendarDateIn,
  hasDateEnded,
  isLoanOverdue,
  loanDaysOverdue,
} from '../../shared/domain/planning/loan-overdue';
import { checkPriceAgainstBand, type PriceBand } from '../../shared/domain/planning/price-band';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { ProductBrief } from '../../shared/schemas/catalog';
import type { MatrixCell, MatrixProgress, QueueItem } from '../../shared/schemas/matrix';
import type { PersonRef } from '../../shared/schemas/planning-fields';
import type { PriceCheck, RoundupEntry, RoundupSummary } from '../../shared/schemas/roundups';
import type { Sample } from '../../shared/schemas/samples';

export function bandOf(roundup: RoundupEntity): PriceBand {
  return {
    minMinor: roundup.priceMinMinor,
    maxMinor: roundup.priceMaxMinor,
    currency: roundup.currency,
    region: roundup.region,
  };
}

/** Today's calendar date where the roundup's outlet is. */
export function roundupToday(roundup: RoundupEntity, now: Date): string {
  return calendarDateIn(roundup.timeZone, now);
}

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

/** Cells that are done (or waiting for the editor) are never overdue. */
const finishedStates = new Set<CellState>(['recorded', 'accepted']);

export function toMatrixCellDto(
  cell: MatrixCellEntity,
  timeZone: string,
  people: Map<number, PersonRef>,
  user: CurrentUser,
  now: Date,
): MatrixCell {
  return {
    id: cell.id,
    roundupId: cell.roundupId,
    entryId: cell.entryId,
    loadConfigurationId: cell.loadConfigurationId,
    state: cell.state,
    tester: personOrNull(people, cell.testerId),
    dueDate: cell.dueDate,
    overdue: cell.dueDate != null && !finishedStates.has(cell.state) && hasDateEnded(cell.dueDate, timeZone, now),
    note: cell.note,
    stateChangedAt: cell.stateChangedAt.toISOString(),
    actions: availableCellActions({ state: cell.state, testerId: cell.testerId }, user),
  };
}

export function emptyProgress(): MatrixProgress {
  return {
    cellCount: 0,
    acceptedCount: 0,
    percentAccepted: 0,
    unassignedCount: 0,
    countsByState: Object.fromEntries(cellStates.map((s) => [s, 0])) as MatrixProgress['countsByState'],
  };
}

/** Matrix progress per roundup: cells by state, accepted share, and cells nobody is assigned to. */
export async function progressByRoundup(
  manager: EntityManager,
  roundupIds: number[],
): Promise<Map<number, MatrixProgress>> {
  const progress = new Map<number, MatrixProgress>();
  for (const id of roundupIds) progress.set(id, emptyProgress());
  if (roundupIds.length === 0) return progress;
  const rows: { roundup_id: number; state: CellState; n: string }[] = await manager.query(
    `SELECT roundup_id, state, COUNT(*) AS n FROM matrix_cells
     WHERE roundup_id IN (${roundupIds.map(() => '?').join(',')}) GROUP BY roundup_id, state`,
    roundupIds,
  );
  for (const row of rows) {
    const p = progress.get(Number(row.roundup_id));
    if (!p) continue;
    const n = Number(row.n);
    p.countsByState[row.state] = n;
    p.cellCount += n;
  }
  for (const p of progress.values()) {
    p.acceptedCount = p.countsByState.accepted;
    p.unassignedCount = p.countsByState['not-started'];
    // Floor, so 100 % means every cell is accepted.
    p.percentAccepted = p.cellCount === 0 ? 0 : Math.floor((p.acceptedCount * 100) / p.cellCount);
  }
  return progress;
}

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
  const entries = await manager.getRepository(RoundupEntryEntity).findBy({ id: In(samples.map((s) => s.entryId)) });
  const entryById = new Map(entries.map((e) => [e.id, e]));
  const products = await productBriefs(
    manager,
    entries.map((e) => e.productId),
  );
  return samples.map((sample) => {
    const entry = entryById.get(sample.entryId) as RoundupEntryEntity;
    const roundup = byId.get(entry.roundupId) as RoundupEntity;
    return toSampleDto(sample, entry, products.get(entry.productId) as ProductBrief, roundup.timeZone, now);
  });
}

export async function productBriefs(manager: EntityManager, ids: number[]): Promise<Map<number, ProductBrief>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const products = await manager.getRepository(ProductEntity).findBy({ id: In(unique) });
  return new Map(products.map((p) => [p.id, toProductBrief(p)]));
}

export async function roundupSummaries(
  manager: EntityManager,
  roundups: RoundupEntity[],
  now: Date,
): Promise<RoundupSummary[]> {
  const ids = roundups.map((r) => r.id);
  const progress = await progressByRoundup(manager, ids);
  const entryCounts = new Map<string, number>();
  if (ids.length > 0) {
    const rows: { roundup_id: number; kind: string; n: string }[] = await manager.query(
      `SELECT roundup_id, kind, COUNT(*) AS n FROM roundup_entries WHERE roundup_id IN (${ids.map(() => '?').join(',')})
       GROUP BY roundup_id, kind`,
      ids,
    );
    for (const row of rows) entryCounts.set(`${row.roundup_id}:${row.kind}`, Number(row.n));
  }
  const overdue = new Map<number, number>();
  for (const sample of await samplesOfRoundups(manager, roundups, now, { onlyOpenLoans: true })) {
    if (sample.overdue) overdue.set(sample.roundupId, (overdue.get(sample.roundupId) ?? 0) + 1);
  }
  const people = await loadPeople(
    manager,
    roundups.map((r) => r.createdBy),
  );
  return roundups.map((roundup) => ({
    id: roundup.id,
    title: roundup.title,
    category: roundup.category as RoundupSummary['category'],
    platform: roundup.platform,
    state: roundup.state,
    priceBand: bandOf(roundup),
    targetPublishDate: roundup.targetPublishDate,
    timeZone: roundup.timeZone,
    benchProfileId: roundup.benchProfileId,
    testedEntryCount: entryCounts.get(`${roundup.id}:tested`) ?? 0,
    referenceEntryCount: entryCounts.get(`${roundup.id}:reference`) ?? 0,
    progress: progress.get(roundup.id) ?? emptyProgress(),
    overdueSampleCount: overdue.get(roundup.id) ?? 0,
    createdBy: personOrNull(people, roundup.createdBy),
    stateChangedAt: roundup.stateChangedAt.toISOString(),
    createdAt: roundup.createdAt.toISOString(),
    updatedAt: roundup.updatedAt.toISOString(),
  }));
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

/** Cells with their roundup, product and configuration, for lists outside the matrix. */
export async function queueItems(
  manager: EntityManager,
  cells: MatrixCellEntity[],
  user: CurrentUser,
  now: Date,
): Promise<QueueItem[]> {
  if (cells.length === 0) return [];
  const roundups = await manager
    .getRepository(RoundupEntity)
    .findBy({ id: In([...new Set(cells.map((c) => c.roundupId))]) });
  const roundupById = new Map(roundups.map((r) => [r.id, r]));
  const entries = await manager
    .getRepository(RoundupEntryEntity)
    .findBy({ id: In([...new Set(cells.map((c) => c.entryId))]) });
  const entryById = new Map(entries.map((e) => [e.id, e]));
  const products = await productBriefs(
    manager,
    entries.map((e) => e.productId),
  );
  const configs = await manager.getRepository(LoadConfigurationEntity).find({
    where: { id: In([...new Set(cells.map((c) => c.loadConfigurationId))]) },
    select: { id: true, name: true },
  });
  const configById = new Map(configs.map((c) => [c.id, c]));
  const people = await loadPeople(
    manager,
    cells.map((c) => c.testerId),
  );
  return cells.map((cell) => {
    const roundup = roundupById.get(cell.roundupId) as RoundupEntity;
    const entry = entryById.get(cell.entryId) as RoundupEntryEntity;
    const config = configById.get(cell.loadConfigurationId) as LoadConfigurationEntity;
    return {
      cell: toMatrixCellDto(cell, roundup.timeZone, people, user, now),
      roundup: { id: roundup.id, title: roundup.title, state: roundup.state, timeZone: roundup.timeZone },
      product: products.get(entry.productId) as ProductBrief,
      loadConfiguration: { id: config.id, name: config.name },
    };
  });
}
