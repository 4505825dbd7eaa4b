import { In, type EntityManager } from 'typeorm';
import { BenchProfileEntity } from '../entities/bench-profile.entity';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { PhotoEntity } from '../entities/photo.entity';
import { ProductEntity } from '../entities/product.entity';
import { ProductPriceEntity } from '../entities/product-price.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { RunAnalysisEntity } from '../entities/run-analysis.entity';
import { SampleEntity } from '../entities/sample.entity';
import { StoredFileEntity } from '../entities/stored-file.entity';
import { TestRunEntity } from '../entities/test-run.entity';
import { benchProfileSystem } from '../mappers/bench-profile';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import {
  effectivePhaseCount,
  phaseMultiplicationLabels,
  vcoreRatedCurrentA,
  vcoreStageCount,
  type PhaseMultiplication,
} from '../../shared/domain/planning/power-design';
import {
  defaultVerdictRubric,
  verdictRubricSchema,
  type AnalysisResult,
  type VerdictRubric,
} from '../../shared/schemas/analysis';
import { sampleSourceLabels } from '../../shared/schemas/samples';
import type { RoundupState } from '../../shared/domain/planning/roundup-states';
import { publicPaths } from './public-paths';

/**
 * The frozen "published roundup": everything the reader pages, feeds, JSON-LD and open data need, built once from the
 * database at publication and stored as JSON. Renderers read only this, so a later edit in the app reaches readers
 * only when an editor publishes an update. Figures are plain numbers in °C and W; units are converted when rendered.
 */
export const publishedRoundupModelVersion = 1;

/** States in which a roundup is on the public site. */
export const publicRoundupStates: readonly RoundupState[] = ['live', 'updated'];

export interface PublishedConfiguration {
  id: number;
  name: string;
  cpuDescription: string;
  /** "platform-default", "fixed", …: as the load configuration records it. */
  settingsMode: string;
  fixedClockMhz: number | null;
  settingsNotes: string | null;
  packagePowerW: number;
  coreVoltageV: number;
  soakMinutes: number;
}

export interface PublishedBenchProfile {
  id: number;
  name: string;
  caseAndFans: string;
  cooler: string;
  psu: string;
  memory: string;
  roomTargetC: number;
  roomToleranceC: number;
  probeType: string;
  probePlacement: string;
  requiredSoakMinutes: number;
}

export interface PublishedPhoto {
  id: number;
  kind: string;
  caption: string;
  altText: string;
  width: number;
  height: number;
  /** Public URLs of the web sizes, smallest first. */
  sources: { url: string; width: number; height: number; format: 'webp' | 'jpeg' }[];
}

export interface PublishedPowerDesign {
  controller: string | null;
  controllerPhases: number | null;
  phaseMultiplication: string | null;
  effectivePhases: number | null;
  stagesPerPhase: number | null;
  vcoreStageCount: number | null;
  vcoreStageType: string | null;
  vcoreStagePart: string | null;
  vcoreStageCurrentA: number | null;
  vcoreRatedCurrentA: number | null;
  socRailStages: number | null;
  otherRails: string | null;
  heatsinkNotes: string | null;
}

export interface PublishedProduct {
  entryId: number;
  productId: number;
  name: string;
  maker: string;
  model: string;
  formFactor: string;
  chipset: string;
  socket: string;
  /** Public page of the board across roundups. */
  path: string;
  /** Tested in this roundup, or shown for reference from an earlier published roundup. */
  kind: 'tested' | 'reference';
  reference: { roundupId: number; title: string; path: string } | null;
  /** The editor's label (Bench pick, Recommended, …); null until one is given. */
  label: string | null;
  /** The price observed in the roundup's region on or before publication. */
  priceAtPublication: { amountMinor: number; currency: string; observedOn: string } | null;
  sample: { source: 'retail' | 'vendor-loan'; sourceLabel: string; firmwareOnArrival: string | null } | null;
  powerDesign: PublishedPowerDesign;
  photos: PublishedPhoto[];
  /** The write-up section, already sanitised HTML; null until the editorial write-up provides one. */
  writeUpHtml: string | null;
}

export type PublishedVerdictStatus = 'final' | 'provisional' | 'withheld';

export interface PublishedResult {
  entryId: number;
  productId: number;
  configurationId: number;
  /** measured: a run of record with figures the QA checks support; withheld: a run of record without a verdict. */
  status: 'measured' | 'withheld';
  runId: number;
  /** Entered by hand from a display: no logger file backs it. */
  manual: boolean;
  firmware: string;
  peakC: number | null;
  ambientC: number | null;
  deltaOverAmbientC: number | null;
  normalizedPeakC: number | null;
  /** ± °C at the peak from the thermocouple's tolerance class; null when not known (manual entries). */
  toleranceC: number | null;
  toleranceClass: string | null;
  verdict: { status: PublishedVerdictStatus; code: string | null; label: string } | null;
  throttled: boolean;
  /** Minutes of soak logged; null for manual entries. */
  soakMinutes: number | null;
  /** Words a reader needs beside the figure (provisional, entered by hand, QA notes). */
  notes: string[];
  /** Raw logger file name offered in the open data, when the editor allows it; null otherwise. */
  rawFile: { path: string; name: string } | null;
  /** What the analysis engine was given (mapping, options, rubric) and its version, for the open data. */
  analysis: { engineVersion: string; parameters: Record<string, unknown> };
}

export interface PublishedCorrection {
  /** ISO 8601 instant. */
  at: string;
  kind: 'correction' | 'update';
  note: string;
}

export interface PublishedRoundup {
  modelVersion: typeof publishedRoundupModelVersion;
  roundupId: number;
  title: string;
  /** The headline readers see; the title until the write-up gives its own. */
  headline: string;
  standfirst: string | null;
  category: string;
  platform: string;
  path: string;
  /** ISO 8601 instants. */
  publishedAt: string;
  updatedAt: string;
  region: string;
  priceBand: { minMinor: number; maxMinor: number; currency: string };
  benchProfile: PublishedBenchProfile | null;
  configurations: PublishedConfiguration[];
  rubric: VerdictRubric;
  steadyStateRule: string | null;
  toleranceStandard: string | null;
  /** Signed-off write-up sections as sanitised HTML (the editorial renderer); null where there is none. */
  writeUp: { introductionHtml: string | null; methodologyHtml: string | null; conclusionHtml: string | null };
  products: PublishedProduct[];
  results: PublishedResult[];
  /** The picks summary, in the order the editor gave: products with a label. */
  picks: { entryId: number; label: string }[];
  corrections: PublishedCorrection[];
  /**
   * Chart images per configuration (the PNG rendered when the chart was approved), as they stood at publication; used
   * for social previews. `storageKey` names the bytes in the file store (never shown to readers).
   */
  chartImages: {
    configurationId: number;
    url: string;
    width: number;
    height: number;
    key?: string;
    storageKey?: string;
  }[];
  openData: {
    csvPath: string;
    analysisJsonPath: string;
    rawFilesAllowed: boolean;
    licence: string;
  };
}

export interface BuildPublishedRoundupOptions {
  /** The publication instant (the embargo time, or now); prices are taken as of this date. */
  publishedAt: Date;
  /** The instant of the latest published update; publishedAt when there was none. */
  updatedAt?: Date;
  corrections?: PublishedCorrection[];
  labels?: { entryId: number; label: string }[];
  headline?: string | null;
  standfirst?: string | null;
  /** Sanitised write-up HTML per roundup entry. */
  writeUps?: Map<number, string>;
  /** Sanitised HTML of the write-up's introduction, how-we-tested and conclusion sections. */
  writeUpSections?: {
    introductionHtml?: string | null;
    methodologyHtml?: string | null;
    conclusionHtml?: string | null;
  };
  chartImages?: PublishedRoundup['chartImages'];
  /** Whether raw logger files are offered; the roundup's own setting when omitted. */
  rawFilesAllowed?: boolean;
  /** The outlet's licence line for open data; the default below when omitted. */
  licence?: string;
}

export const defaultOpenDataLicence = 'You may reuse these results with credit to the outlet and a link to this page.';

const num = (value: string | null | undefined): number | null =>
  value === null || value === undefined || value === '' ? null : Number(value);

function powerDesignOf(product: ProductEntity): PublishedPowerDesign {
  const multiplication = product.phaseMultiplication as PhaseMultiplication | null;
  const known = product.controllerPhases !== null && multiplication !== null;
  const effective = known ? effectivePhaseCount(product.controllerPhases as number, multiplication) : null;
  const stages =
    known && product.stagesPerPhase !== null
      ? vcoreStageCount(product.controllerPhases as number, multiplication, product.stagesPerPhase)
      : null;
  const stageCurrentA = num(product.vcoreStageCurrentA);
  return {
    controller: product.vrmController,
    controllerPhases: product.controllerPhases,
    phaseMultiplication: multiplication ? (phaseMultiplicationLabels[multiplication] ?? multiplication) : null,
    effectivePhases: effective ?? product.effectivePhases,
    stagesPerPhase: product.stagesPerPhase,
    vcoreStageCount: stages,
    vcoreStageType: product.vcoreStageType,
    vcoreStagePart: product.vcoreStagePart,
    vcoreStageCurrentA: stageCurrentA,
    vcoreRatedCurrentA: stages !== null && stageCurrentA !== null ? vcoreRatedCurrentA(stages, stageCurrentA) : null,
    socRailStages: product.socRailStages,
    otherRails: product.otherRails,
    heatsinkNotes: product.heatsinkNotes,
  };
}

/** The reader-facing words for a run of record beside its figure. */
function resultNotes(run: TestRunEntity, result: Partial<AnalysisResult>): string[] {
  const notes: string[] = [];
  if (run.source === 'manual') notes.push('Entered by hand from the logger display: no logger file backs this figure.');
  if (result.verdict?.status === 'provisional') {
    notes.push(
      'Provisional: the soak ended before the temperature settled; the verdict is judged on the predicted steady state.',
    );
  }
  if (result.verdict?.status === 'withheld') {
    notes.push('No figure is reported: the quality checks of this run do not support one.');
  }
  for (const concern of result.verdict?.concerns ?? []) {
    if (concern.effect === 'read-with' && concern.code !== 'manual-entry') notes.push(`Read with: ${concern.label}.`);
  }
  return notes;
}

/**
 * Builds the published model of a roundup from the database. Only runs of record that an editor accepted count; a
 * withheld verdict publishes no figure; reference entries show an earlier roundup's results only when that roundup
 * is itself published.
 */
export async function buildPublishedRoundup(
  manager: EntityManager,
  roundupId: number,
  options: BuildPublishedRoundupOptions,
): Promise<PublishedRoundup> {
  const roundup = await manager.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId });
  const path = publicPaths.roundup(roundup.id, roundup.title);
  const configLinks = await manager
    .getRepository(RoundupLoadConfigurationEntity)
    .find({ where: { roundupId }, order: { position: 'ASC' } });
  const configRows = configLinks.length
    ? await manager
        .getRepository(LoadConfigurationEntity)
        .findBy({ id: In(configLinks.map((l) => l.loadConfigurationId)) })
    : [];
  const configurations: PublishedConfiguration[] = configLinks
    .map((link) => configRows.find((c) => c.id === link.loadConfigurationId))
    .filter((c): c is LoadConfigurationEntity => c !== undefined)
    .map((c) => ({
      id: c.id,
      name: c.name,
      cpuDescription: c.cpuDescription,
      settingsMode: c.settingsMode,
      fixedClockMhz: c.fixedClockMhz,
      settingsNotes: c.settingsNotes,
      packagePowerW: Number(c.expectedPackagePowerW),
      coreVoltageV: Number(c.coreVoltageV),
      soakMinutes: c.soakMinutes,
    }));
  const configIds = configurations.map((c) => c.id);

  const profile = roundup.benchProfileId
    ? await manager.getRepository(BenchProfileEntity).findOneBy({ id: roundup.benchProfileId })
    : null;

  const entries = await manager.getRepository(RoundupEntryEntity).find({
    where: { roundupId },
    order: { position: 'ASC', id: 'ASC' },
  });
  const productRows = entries.length
    ? await manager.getRepository(ProductEntity).findBy({ id: In(entries.map((e) => e.productId)) })
    : [];
  const referenceIds = [...new Set(entries.map((e) => e.referenceRoundupId).filter((id): id is number => !!id))];
  const referenceRoundups = referenceIds.length
    ? await manager.getRepository(RoundupEntity).findBy({ id: In(referenceIds) })
    : [];
  const publishedReferences = new Map(
    referenceRoundups.filter((r) => publicRoundupStates.includes(r.state)).map((r) => [r.id, r]),
  );

  // The cells that stand for each entry: its own for tested entries, the earlier roundup's for reference entries.
  const cellSources = entries.map((entry) => ({
    entry,
    roundupId: entry.kind === 'reference' ? entry.referenceRoundupId : roundupId,
  }));
  const cellRoundupIds = [
    ...new Set(cellSources.map((s) => s.roundupId).filter((id): id is number => id !== null)),
  ].filter((id) => id === roundupId || publishedReferences.has(id));
  const cells = cellRoundupIds.length
    ? await manager.getRepository(MatrixCellEntity).findBy({ roundupId: In(cellRoundupIds) })
    : [];
  const allEntries = cellRoundupIds.some((id) => id !== roundupId)
    ? await manager.getRepository(RoundupEntryEntity).findBy({ roundupId: In(cellRoundupIds) })
    : entries;
  const runIds = cells.map((c) => c.runOfRecordId).filter((id): id is number => id !== null);
  const runs = runIds.length ? await manager.getRepository(TestRunEntity).findBy({ id: In(runIds) }) : [];
  const analyses = runIds.length
    ? await manager
        .getRepository(RunAnalysisEntity)
        .createQueryBuilder('a')
        .where('a.test_run_id IN (:...runIds)', { runIds })
        .andWhere('a.id = (SELECT MAX(b.id) FROM run_analyses b WHERE b.test_run_id = a.test_run_id)')
        .getMany()
    : [];
  const analysisByRun = new Map(analyses.map((a) => [a.testRunId, a]));
  const loggerFileIds = runs.map((r) => r.loggerFileId).filter((id): id is number => id !== null);
  const loggerFiles = loggerFileIds.length
    ? await manager.getRepository(StoredFileEntity).findBy({ id: In(loggerFileIds) })
    : [];
  const rawFilesAllowed = options.rawFilesAllowed ?? roundup.openDataRawFiles === true;

  const results: PublishedResult[] = [];
  for (const { entry, roundupId: sourceRoundupId } of cellSources) {
    if (sourceRoundupId === null || !cellRoundupIds.includes(sourceRoundupId)) continue;
    const sourceEntry = allEntries.find((e) => e.roundupId === sourceRoundupId && e.productId === entry.productId);
    if (!sourceEntry) continue;
    for (const configurationId of configIds) {
      const cell = cells.find((c) => c.entryId === sourceEntry.id && c.loadConfigurationId === configurationId);
      const run = cell?.runOfRecordId ? runs.find((r) => r.id === cell.runOfRecordId) : undefined;
      // A run of record stands once QA accepted it, or once the editor accepted its cell with it as the run of record
      // (what readiness asks for); a run sent back never does.
      if (!run || run.reviewState === 'sent-back') continue;
      if (run.reviewState !== 'accepted' && cell?.state !== 'accepted') continue;
      const analysis = analysisByRun.get(run.id);
      if (!analysis) continue;
      const result = analysis.result as Partial<AnalysisResult>;
      const verdictStatus = result.verdict?.status ?? null;
      const withheld = verdictStatus === 'withheld' || verdictStatus === null;
      const file = run.loggerFileId ? loggerFiles.find((f) => f.id === run.loggerFileId) : undefined;
      const extension = file ? (/\.[a-z0-9]{1,5}$/i.exec(file.originalName)?.[0].toLowerCase() ?? '.csv') : '.csv';
      results.push({
        entryId: entry.id,
        productId: entry.productId,
        configurationId,
        status: withheld ? 'withheld' : 'measured',
        runId: run.id,
        manual: run.source === 'manual',
        firmware: run.firmwareVersion,
        peakC: withheld ? null : num(analysis.peakC),
        ambientC: withheld ? null : num(analysis.ambientC),
        deltaOverAmbientC: withheld ? null : num(analysis.deltaOverAmbientC),
        normalizedPeakC: withheld ? null : num(analysis.normalisedPeakC),
        toleranceC: withheld ? null : (result.uncertainty?.peakToleranceC ?? null),
        toleranceClass: result.uncertainty?.toleranceClass ?? null,
        verdict:
          result.verdict && verdictStatus
            ? { status: verdictStatus, code: result.verdict.code ?? null, label: result.verdict.label }
            : null,
        throttled: !withheld && (result.throttle?.detected === true || analysis.verdict === 'throttled'),
        soakMinutes: run.source === 'manual' || result.soakS === undefined ? null : Math.round(result.soakS / 60),
        notes: resultNotes(run, result),
        rawFile:
          rawFilesAllowed && file && sourceRoundupId === roundupId
            ? { path: publicPaths.rawLog(path, run.id, extension), name: `run-${run.id}${extension}` }
            : null,
        analysis: { engineVersion: analysis.engineVersion, parameters: analysis.parameters },
      });
    }
  }

  // Prices as of the publication date, in the roundup's region.
  const publishedOn = options.publishedAt.toISOString().slice(0, 10);
  const prices = productRows.length
    ? await manager
        .getRepository(ProductPriceEntity)
        .createQueryBuilder('p')
        .where('p.product_id IN (:...ids)', { ids: productRows.map((p) => p.id) })
        .andWhere('p.region = :region', { region: roundup.region })
        .andWhere('p.observed_on <= :on', { on: publishedOn })
        .orderBy('p.observed_on', 'DESC')
        .addOrderBy('p.id', 'DESC')
        .getMany()
    : [];
  const samples = entries.length
    ? await manager.getRepository(SampleEntity).findBy({ entryId: In(entries.map((e) => e.id)) })
    : [];
  const photos = entries.length
    ? await manager
        .getRepository(PhotoEntity)
        .find({ where: { roundupId }, order: { entryId: 'ASC', position: 'ASC', id: 'ASC' } })
    : [];

  const labels = options.labels ?? [];
  const products: PublishedProduct[] = [];
  for (const entry of entries) {
    const product = productRows.find((p) => p.id === entry.productId);
    if (!product) continue;
    const reference = entry.referenceRoundupId ? publishedReferences.get(entry.referenceRoundupId) : undefined;
    // A reference entry whose earlier roundup is not public would reveal unpublished results: it is left out.
    if (entry.kind === 'reference' && !reference) continue;
    const name = productDisplayName(product);
    const price = prices.find((p) => p.productId === product.id);
    const sample = samples.find((s) => s.entryId === entry.id);
    products.push({
      entryId: entry.id,
      productId: product.id,
      name,
      maker: product.maker,
      model: product.model,
      formFactor: product.formFactor,
      chipset: product.chipset,
      socket: product.socket,
      path: publicPaths.product(product.id, name),
      kind: entry.kind,
      reference: reference
        ? { roundupId: reference.id, title: reference.title, path: publicPaths.roundup(reference.id, reference.title) }
        : null,
      label: labels.find((l) => l.entryId === entry.id)?.label ?? null,
      priceAtPublication: price
        ? { amountMinor: price.amountMinor, currency: price.currency, observedOn: price.observedOn }
        : null,
      sample:
        entry.kind === 'tested' && sample?.source
          ? {
              source: sample.source,
              sourceLabel: sampleSourceLabels[sample.source],
              firmwareOnArrival: sample.firmwareOnArrival,
            }
          : null,
      powerDesign: powerDesignOf(product),
      photos: photos
        .filter((photo) => photo.entryId === entry.id)
        .map((photo) => ({
          id: photo.id,
          kind: photo.kind,
          caption: photo.caption,
          altText: photo.altText,
          width: photo.width,
          height: photo.height,
          sources: [...photo.derivatives]
            .sort((a, b) => a.width - b.width)
            .map((d) => ({
              url: publicPaths.photo(photo.id, d.width, d.format),
              width: d.width,
              height: d.height,
              format: d.format,
            })),
        })),
      writeUpHtml: options.writeUps?.get(entry.id) ?? null,
    });
  }
  const shownEntries = new Set(products.map((p) => p.entryId));

  const firstResult = analyses.map((a) => a.result as Partial<AnalysisResult>).find((r) => r.steadyStateRule);
  return {
    modelVersion: publishedRoundupModelVersion,
    roundupId: roundup.id,
    title: roundup.title,
    headline: options.headline?.trim() || roundup.title,
    standfirst: options.standfirst?.trim() || null,
    category: roundup.category,
    platform: roundup.platform,
    path,
    publishedAt: options.publishedAt.toISOString(),
    updatedAt: (options.updatedAt ?? options.publishedAt).toISOString(),
    region: roundup.region,
    priceBand: { minMinor: roundup.priceMinMinor, maxMinor: roundup.priceMaxMinor, currency: roundup.currency },
    benchProfile: profile
      ? {
          ...benchProfileSystem(profile),
          roomTargetC: Number(profile.roomTempTargetC),
          roomToleranceC: Number(profile.roomTempToleranceC),
          probeType: profile.probeType,
          probePlacement: profile.probePlacement,
          requiredSoakMinutes: profile.requiredSoakMinutes,
        }
      : null,
    configurations,
    rubric: roundup.verdictRubric ? verdictRubricSchema.parse(roundup.verdictRubric) : defaultVerdictRubric,
    steadyStateRule: firstResult?.steadyStateRule ?? null,
    toleranceStandard:
      analyses.map((a) => (a.result as Partial<AnalysisResult>).uncertainty?.standard).find(Boolean) ?? null,
    writeUp: {
      introductionHtml: options.writeUpSections?.introductionHtml ?? null,
      methodologyHtml: options.writeUpSections?.methodologyHtml ?? null,
      conclusionHtml: options.writeUpSections?.conclusionHtml ?? null,
    },
    products,
    results: results.filter((r) => shownEntries.has(r.entryId)),
    picks: labels.filter((l) => shownEntries.has(l.entryId)),
    corrections: options.corrections ?? [],
    chartImages: options.chartImages ?? [],
    openData: {
      csvPath: publicPaths.roundupCsv(path),
      analysisJsonPath: publicPaths.roundupAnalysisJson(path),
      rawFilesAllowed,
      licence: options.licence?.trim() || defaultOpenDataLicence,
    },
  };
}
