// The facts verdicts, charts and readiness read about a roundup: its configurations and entries, each cell's run of
// record with its current analysis, the reference entries' runs of record in their earlier roundups, prices and
// exclusions. Read once per request, in one place, so the three never disagree.
import { In, type EntityManager } from 'typeorm';
import { BenchProfileEntity } from '../entities/bench-profile.entity';
import { EditorialVerdictEntity } from '../entities/editorial-verdict.entity';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { MatrixCellExclusionEntity } from '../entities/matrix-cell-exclusion.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { ProductEntity } from '../entities/product.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { RunAnalysisEntity } from '../entities/run-analysis.entity';
import { TestRunEntity } from '../entities/test-run.entity';
import { priceHistoryByProduct } from '../mappers/product-fields';
import { findRoundup } from './roundup-access';
import type { ChartSources, PriceFacts, RunOfRecordFacts } from '../../shared/domain/editorial/chart-data';
import { latestPriceInRegion } from '../../shared/domain/planning/price-band';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import type { AnalysisResult, ToleranceClass, VerdictCode, VerdictStatus } from '../../shared/schemas/analysis';
import type { LoadSettingsMode } from '../../shared/schemas/load-configurations';

const defaultToleranceClass: ToleranceClass = 'iec-60584-1-class-2';
/** The room normalised peaks refer to, as the engine's default (REFERENCES.md: controlled room near 21 °C, no source). */
const referenceRoomDefaultC = 21;

export interface EditorialFacts {
  roundup: RoundupEntity;
  configurations: LoadConfigurationEntity[];
  tested: { entry: RoundupEntryEntity; product: ProductEntity; name: string }[];
  references: { entry: RoundupEntryEntity; product: ProductEntity; name: string; roundupTitle: string }[];
  cells: MatrixCellEntity[];
  exclusions: Map<number, MatrixCellExclusionEntity>;
  verdicts: Map<number, EditorialVerdictEntity>;
  /** Newest catalog price of each tested product in the roundup's region. */
  catalogPrices: Map<number, { amountMinor: number; currency: string }>;
  sources: ChartSources;
}

function runFacts(
  entryId: number,
  loadConfigurationId: number,
  run: TestRunEntity,
  analysis: RunAnalysisEntity,
): RunOfRecordFacts {
  const result = analysis.result as Partial<AnalysisResult> & { verdict?: { status?: VerdictStatus; label?: string } };
  const options = (analysis.parameters as { options?: { toleranceClass?: ToleranceClass } }).options;
  const number = (value: string | null) => (value === null ? null : Number(value));
  return {
    entryId,
    loadConfigurationId,
    runId: run.id,
    analysisId: analysis.id,
    source: run.source,
    peakC: number(analysis.peakC),
    ambientC: number(analysis.ambientC),
    deltaOverAmbientC: number(analysis.deltaOverAmbientC),
    normalisedPeakC: number(analysis.normalisedPeakC),
    throttled: result.throttle?.detected === true || analysis.verdict === 'throttled',
    verdictCode: (analysis.verdict as VerdictCode | null) ?? null,
    verdictStatus: result.verdict?.status ?? (analysis.verdict ? 'final' : null),
    verdictLabel: result.verdict?.label ?? null,
    toleranceClass: options?.toleranceClass ?? defaultToleranceClass,
  };
}

/** Runs of record of the given cells with their newest analyses, keyed by cell id. */
async function runsOfRecord(manager: EntityManager, cells: MatrixCellEntity[]) {
  const runIds = cells.flatMap((c) => (c.runOfRecordId === null ? [] : [c.runOfRecordId]));
  const byCell = new Map<number, { run: TestRunEntity; analysis: RunAnalysisEntity }>();
  if (runIds.length === 0) return byCell;
  const runs = await manager.getRepository(TestRunEntity).findBy({ id: In(runIds) });
  const analyses = await manager
    .getRepository(RunAnalysisEntity)
    .find({ where: { testRunId: In(runIds) }, order: { id: 'ASC' } });
  const latest = new Map<number, RunAnalysisEntity>();
  for (const analysis of analyses) latest.set(analysis.testRunId, analysis);
  for (const cell of cells) {
    const run = runs.find((r) => r.id === cell.runOfRecordId);
    const analysis = run ? latest.get(run.id) : undefined;
    if (run && analysis) byCell.set(cell.id, { run, analysis });
  }
  return byCell;
}

export async function loadEditorialFacts(manager: EntityManager, roundupId: number): Promise<EditorialFacts> {
  const roundup = await findRoundup(manager, roundupId);
  const profile = roundup.benchProfileId
    ? await manager.getRepository(BenchProfileEntity).findOneBy({ id: roundup.benchProfileId })
    : null;
  const links = await manager
    .getRepository(RoundupLoadConfigurationEntity)
    .find({ where: { roundupId }, order: { position: 'ASC' } });
  const configRows = links.length
    ? await manager.getRepository(LoadConfigurationEntity).findBy({ id: In(links.map((l) => l.loadConfigurationId)) })
    : [];
  const configurations = links.flatMap((l) => configRows.filter((c) => c.id === l.loadConfigurationId));
  const entries = await manager
    .getRepository(RoundupEntryEntity)
    .find({ where: { roundupId }, order: { position: 'ASC', id: 'ASC' } });
  const products = entries.length
    ? await manager.getRepository(ProductEntity).findBy({ id: In(entries.map((e) => e.productId)) })
    : [];
  const productOf = (entry: RoundupEntryEntity) => products.find((p) => p.id === entry.productId) as ProductEntity;
  const referenceRoundupIds = [
    ...new Set(entries.flatMap((e) => (e.referenceRoundupId ? [e.referenceRoundupId] : []))),
  ];
  const referenceRoundups = referenceRoundupIds.length
    ? await manager.getRepository(RoundupEntity).findBy({ id: In(referenceRoundupIds) })
    : [];
  const tested = entries
    .filter((e) => e.kind === 'tested')
    .map((entry) => ({ entry, product: productOf(entry), name: productDisplayName(productOf(entry)) }));
  const references = entries
    .filter((e) => e.kind === 'reference' && e.referenceRoundupId !== null)
    .map((entry) => ({
      entry,
      product: productOf(entry),
      name: productDisplayName(productOf(entry)),
      roundupTitle: referenceRoundups.find((r) => r.id === entry.referenceRoundupId)?.title ?? 'an earlier roundup',
    }));

  const cells = await manager.getRepository(MatrixCellEntity).findBy({ roundupId });
  const ofRecord = await runsOfRecord(manager, cells);
  const runs: RunOfRecordFacts[] = [];
  for (const cell of cells) {
    const found = ofRecord.get(cell.id);
    if (found) runs.push(runFacts(cell.entryId, cell.loadConfigurationId, found.run, found.analysis));
  }

  // A reference entry shows its product's runs of record in the earlier roundup, matched by load configuration.
  const referenceRuns: RunOfRecordFacts[] = [];
  for (const reference of references) {
    const earlierEntry = await manager
      .getRepository(RoundupEntryEntity)
      .findOneBy({ roundupId: reference.entry.referenceRoundupId as number, productId: reference.product.id });
    if (!earlierEntry) continue;
    const earlierCells = await manager.getRepository(MatrixCellEntity).findBy({ entryId: earlierEntry.id });
    const earlierRuns = await runsOfRecord(manager, earlierCells);
    for (const cell of earlierCells) {
      const found = earlierRuns.get(cell.id);
      if (found) referenceRuns.push(runFacts(reference.entry.id, cell.loadConfigurationId, found.run, found.analysis));
    }
  }

  const exclusionRows = await manager.getRepository(MatrixCellExclusionEntity).findBy({ roundupId });
  const verdictRows = await manager.getRepository(EditorialVerdictEntity).findBy({ roundupId });
  const verdicts = new Map(verdictRows.map((v) => [v.entryId, v]));
  const history = await priceHistoryByProduct(
    manager,
    tested.map((t) => t.product.id),
    roundup.region,
  );
  const catalogPrices = new Map<number, { amountMinor: number; currency: string }>();
  for (const { entry, product } of tested) {
    const latest = latestPriceInRegion(history.get(product.id) ?? [], roundup.region);
    if (latest) catalogPrices.set(entry.id, { amountMinor: latest.amountMinor, currency: latest.currency });
  }
  const prices: PriceFacts[] = tested.flatMap(({ entry }): PriceFacts[] => {
    const verdict = verdicts.get(entry.id);
    if (verdict) {
      return [
        {
          entryId: entry.id,
          amountMinor: verdict.priceMinor,
          currency: verdict.priceCurrency,
          source: 'verdict' as const,
        },
      ];
    }
    const catalog = catalogPrices.get(entry.id);
    return catalog ? [{ entryId: entry.id, ...catalog, source: 'catalog' as const }] : [];
  });

  return {
    roundup,
    configurations,
    tested,
    references,
    cells,
    exclusions: new Map(exclusionRows.map((x) => [x.cellId, x])),
    verdicts,
    catalogPrices,
    sources: {
      roomTargetC: profile ? Number(profile.roomTempTargetC) : null,
      referenceRoomC: referenceRoomDefaultC,
      configurations: configurations.map((c) => ({
        id: c.id,
        name: c.name,
        settingsMode: c.settingsMode as LoadSettingsMode,
        soakMinutes: c.soakMinutes,
      })),
      tested: tested.map((t) => ({ entryId: t.entry.id, productName: t.name })),
      references: references.map((r) => ({
        entryId: r.entry.id,
        productName: r.name,
        referenceRoundupTitle: r.roundupTitle,
      })),
      runs,
      referenceRuns,
      prices,
      currency: roundup.currency,
    },
  };
}
