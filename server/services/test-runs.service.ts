import { extname } from 'node:path';
import { In, type DataSource, type EntityManager } from 'typeorm';
import { BenchBookingCellEntity } from '../entities/bench-booking-cell.entity';
import { BenchBookingEntity } from '../entities/bench-booking.entity';
import { BenchProfileEntity } from '../entities/bench-profile.entity';
import { BenchEntity } from '../entities/bench.entity';
import { BenchInstrumentEntity } from '../entities/bench-instrument.entity';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { ProductEntity } from '../entities/product.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { RunAnalysisEntity } from '../entities/run-analysis.entity';
import { StoredFileEntity } from '../entities/stored-file.entity';
import { TestRunEntity } from '../entities/test-run.entity';
import { AppError, forbidden, notFound } from '../errors';
import { mayReadCellRuns } from '../../shared/access/roles';
import { recordPlanChange } from '../lib/roundup-audit';
import { sha256InSlices } from '../lib/event-loop-slices';
import { loadPeople, personOrNull } from '../mappers/people';
import type { FileStore } from '../storage/file-store';
import { recordAction } from './audit.service';
import { analysedOrThrow, checkLogFileUpload, type LogFileAnalyser, type LogFileUpload } from './log-check.service';
import { analysisEngineVersion } from '../../shared/domain/analysis/engine-version';
import { repeatRunStatistics } from '../../shared/domain/analysis/repeat-run-statistics';
import { judgeRun } from '../../shared/domain/analysis/verdict-rubric';
import { qaFlagLabels } from '../../shared/domain/analysis/qa-flag-labels';
import { calibrationOverdue, nextCalibrationDue } from '../../shared/domain/planning/calibration';
import { vrmElectricalLoad } from '../../shared/domain/analysis/vrm-electrical-load';
import type { PhaseMultiplication } from '../../shared/domain/planning/power-design';
import {
  defaultVerdictRubric,
  verdictRubricSchema,
  type AnalysisOptionsInput,
  type AnalysisRequestInput,
  type AnalysisResult,
  type ColumnMapping,
  type QaFlag,
  type VerdictRubric,
} from '../../shared/schemas/analysis';
import type { CurrentUser } from '../../shared/schemas/auth';
import type {
  CellRuns,
  ParsedLoggerRunRequest,
  ParsedManualRunRequest,
  ParsedReanalyseRunRequest,
  ParsedReviewRunRequest,
  RoundupResults,
  RunAnalysisSummary,
  TestRun,
  VrmLoadFigures,
} from '../../shared/schemas/test-runs';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';

/** Cell states in which a run may be added: the work is assigned, under way, recorded (a retest) or sent back. */
const runnableStates = new Set(['assigned', 'running', 'recorded', 'needs-retest']);

const toNumber = (value: string | null) => (value === null ? null : Number(value));

/**
 * Test runs on matrix cells: logger files stored byte for byte with their SHA-256 and analysed by the engine (each
 * analysis kept, never edited), manual entries marked as such, review by the editor and the run of record.
 */
export class TestRunsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly files: FileStore,
    private readonly analyser: LogFileAnalyser,
  ) {}

  // ---- reading ----

  async cellRuns(cellId: number, user: CurrentUser): Promise<CellRuns> {
    const manager = this.dataSource.manager;
    const { cell, profile, product, configuration } = await this.cellContext(manager, cellId);
    if (!mayReadCellRuns(user, cell.testerId)) {
      throw forbidden('This cell is assigned to another tester; its runs are open to them and the editors.');
    }
    const runs = await manager
      .getRepository(TestRunEntity)
      .find({ where: { matrixCellId: cellId }, order: { id: 'ASC' } });
    const dtos = await this.runDtos(manager, runs, cell, user);
    const byFirmware = new Map<string, number[]>();
    for (const run of dtos) {
      if (run.analysis.peakC === null) continue;
      const values = byFirmware.get(run.firmwareVersion) ?? [];
      values.push(run.analysis.peakC);
      byFirmware.set(run.firmwareVersion, values);
    }
    const groups = [...byFirmware.entries()].map(([firmwareVersion, peaks]) => {
      const stats = repeatRunStatistics(peaks);
      return { firmwareVersion, runs: stats.runs, meanPeakC: stats.mean, ciLowC: stats.low, ciHighC: stats.high };
    });
    const firstMean = groups[0]?.meanPeakC ?? 0;
    const withDifference = groups.map((group, index) => ({
      ...group,
      differenceFromFirstC: index === 0 ? null : group.meanPeakC - firstMean,
    }));
    return {
      cellId,
      roundupId: cell.roundupId,
      productName: productDisplayName(product),
      loadConfigurationName: configuration.name,
      runOfRecordId: cell.runOfRecordId,
      runs: dtos,
      byFirmware: withDifference,
      rememberedMapping: profile?.logMapping ?? null,
    };
  }

  async run(runId: number, user: CurrentUser): Promise<TestRun> {
    const manager = this.dataSource.manager;
    const { run, cell } = await readableRun(manager, runId, user);
    return (await this.runDtos(manager, [run], cell, user))[0];
  }

  /** The stored logger file, byte for byte, for staff to download (a tester: their own runs). */
  async loggerFile(runId: number, user: CurrentUser): Promise<{ file: StoredFileEntity; body: Buffer }> {
    const manager = this.dataSource.manager;
    const { run } = await readableRun(manager, runId, user);
    if (run.loggerFileId === null) throw notFound('A logger file for that run');
    const file = await manager.getRepository(StoredFileEntity).findOneByOrFail({ id: run.loggerFileId });
    const body = await this.files.get(file.storageKey);
    if (!body) throw new AppError('file_missing', 410, 'The stored file is missing from storage. Tell an admin.');
    return { file, body };
  }

  async results(roundupId: number): Promise<RoundupResults> {
    const manager = this.dataSource.manager;
    const roundup = await manager.getRepository(RoundupEntity).findOneBy({ id: roundupId });
    if (!roundup) throw notFound('That roundup');
    const cells = await manager.getRepository(MatrixCellEntity).findBy({ roundupId });
    const runs = await manager.getRepository(TestRunEntity).find({ where: { roundupId }, order: { id: 'ASC' } });
    const latest = await this.latestAnalyses(
      manager,
      runs.map((r) => r.id),
    );
    const runsByCell = new Map<number, TestRunEntity[]>();
    for (const run of runs) runsByCell.set(run.matrixCellId, [...(runsByCell.get(run.matrixCellId) ?? []), run]);
    return {
      roundupId,
      rubric: this.rubricOf(roundup),
      rubricIsDefault: roundup.verdictRubric === null,
      cells: cells.map((cell) => {
        const cellRuns = runsByCell.get(cell.id) ?? [];
        const shown = cellRuns.find((r) => r.id === cell.runOfRecordId) ?? cellRuns.at(-1) ?? null;
        const analysis = shown ? latest.get(shown.id) : undefined;
        const result = analysis?.result as Partial<AnalysisResult> | undefined;
        return {
          cellId: cell.id,
          entryId: cell.entryId,
          loadConfigurationId: cell.loadConfigurationId,
          runId: shown?.id ?? null,
          runCount: cellRuns.length,
          isRunOfRecord: shown !== null && shown.id === cell.runOfRecordId,
          source: shown?.source ?? null,
          peakC: toNumber(analysis?.peakC ?? null),
          deltaOverAmbientC: toNumber(analysis?.deltaOverAmbientC ?? null),
          verdict: (analysis?.verdict as RoundupResults['cells'][number]['verdict']) ?? null,
          verdictStatus: result?.verdict?.status ?? null,
          verdictLabel: result?.verdict?.label ?? null,
          throttled: result?.throttle?.detected === true || analysis?.verdict === 'throttled',
          flagCount: analysis?.flagCodes ? analysis.flagCodes.split(',').filter(Boolean).length : 0,
          reviewState: shown?.reviewState ?? null,
        };
      }),
    };
  }

  // ---- recording ----

  async createLoggerRun(
    actor: CurrentUser,
    cellId: number,
    file: LogFileUpload | undefined,
    input: ParsedLoggerRunRequest,
  ) {
    const upload = checkLogFileUpload(file);
    // The upload's own memory, not a copy: a 24 MB copy would hold the event loop for tens of milliseconds.
    const bytes = Buffer.from(upload.buffer.buffer, upload.buffer.byteOffset, upload.buffer.byteLength);
    const extension = extname(upload.originalname).toLowerCase();
    const sha256 = await sha256InSlices(bytes);
    const storageKey = `runs/cell-${cellId}/${sha256}${extension}`;
    let stored = false;
    try {
      return await this.dataSource.transaction(async (manager) => {
        const context = await this.lockCellForRun(manager, actor, cellId);
        const same = await manager
          .createQueryBuilder(TestRunEntity, 'run')
          .innerJoin(StoredFileEntity, 'file', 'file.id = run.logger_file_id')
          .where('run.matrix_cell_id = :cellId AND file.sha256 = :sha256', { cellId, sha256 })
          .getOne();
        if (same) {
          throw new AppError(
            'same_file',
            409,
            `This exact file (same SHA-256) is already stored as run ${same.id} of this cell. Nothing was added.`,
            undefined,
          );
        }
        const parameters = this.analysisParameters(context, input.mapping, input.options);
        const { analysis } = analysedOrThrow(await this.analyser(bytes, parameters));
        const booking = await this.bookingFor(manager, context.cell, input);
        await this.files.put(storageKey, bytes, 'text/plain; charset=utf-8');
        stored = true;
        const file = await manager.getRepository(StoredFileEntity).save(
          manager.getRepository(StoredFileEntity).create({
            storageKey,
            sha256,
            byteSize: String(bytes.length),
            contentType: 'text/plain; charset=utf-8',
            originalName: upload.originalname.slice(0, 255),
            uploadedBy: actor.id,
          }),
        );
        const run = await this.insertRun(manager, actor, context.cell, input, booking, {
          source: 'logger',
          loggerFileId: file.id,
        });
        await this.insertAnalysis(manager, actor, run.id, parameters, analysis);
        await this.startCellWithRun(manager, actor, context, run.id);
        if (input.rememberMapping && context.profile) {
          await manager
            .getRepository(BenchProfileEntity)
            .update({ id: context.profile.id }, { logMapping: input.mapping });
        }
        await recordAction(manager, actor, 'test-run.created', ['test-run', run.id], {
          cellId,
          source: 'logger',
          sha256,
          bytes: bytes.length,
          firmware: input.firmwareVersion,
        });
        return run.id;
      });
    } catch (error) {
      if (stored) await this.files.delete(storageKey).catch(() => undefined);
      throw error;
    }
  }

  async createManualRun(actor: CurrentUser, cellId: number, input: ParsedManualRunRequest) {
    return this.dataSource.transaction(async (manager) => {
      const context = await this.lockCellForRun(manager, actor, cellId);
      const booking = await this.bookingFor(manager, context.cell, input);
      const run = await this.insertRun(manager, actor, context.cell, input, booking, {
        source: 'manual',
        manualPeakC: input.manualPeakC.toFixed(1),
        manualAmbientC: input.manualAmbientC.toFixed(1),
      });
      const parameters = { manual: true, options: { rubric: context.rubric, referenceRoomC: 21 } };
      await this.insertAnalysis(manager, actor, run.id, parameters, manualAnalysis(input, context.rubric));
      await this.startCellWithRun(manager, actor, context, run.id);
      await recordAction(manager, actor, 'test-run.created', ['test-run', run.id], {
        cellId,
        source: 'manual',
        peakC: input.manualPeakC,
        ambientC: input.manualAmbientC,
      });
      return run.id;
    });
  }

  /** A new analysis of a stored file with another mapping or options; earlier analyses stay as they were. */
  async reanalyse(actor: CurrentUser, runId: number, input: ParsedReanalyseRunRequest) {
    return this.dataSource.transaction(async (manager) => {
      const run = await findRun(manager, runId, true);
      if (actor.role !== 'editor' && run.testerId !== actor.id)
        throw forbidden('Only the run’s tester or an editor may re-analyse it.');
      const context = await this.cellContext(manager, run.matrixCellId);
      await this.addAnalysisFromStore(manager, actor, run, context, input.mapping, input.options);
      return run.id;
    });
  }

  async review(actor: CurrentUser, runId: number, input: ParsedReviewRunRequest) {
    return this.dataSource.transaction(async (manager) => {
      const run = await findRun(manager, runId, true);
      const cell = await manager
        .getRepository(MatrixCellEntity)
        .findOne({ where: { id: run.matrixCellId }, lock: { mode: 'pessimistic_write' } });
      const analysis = (await this.latestAnalyses(manager, [run.id])).get(run.id);
      const warnings = ((analysis?.result as { flags?: QaFlag[] })?.flags ?? []).filter(
        (f) => f.severity === 'warning',
      );
      if (input.decision === 'accept' && warnings.length > 0 && !input.reason) {
        throw new AppError('reason_required', 422, 'This run has QA flags: write why it can be accepted as it is.', {
          reason: `Write why the run stands despite: ${warnings.map((f) => f.message).join(' ')}`.slice(0, 500),
        });
      }
      if (input.decision === 'send-back' && !input.reason) {
        throw new AppError('reason_required', 422, 'Write what the tester should do again.', {
          reason: 'Write what the tester should do again.',
        });
      }
      run.reviewState = input.decision === 'accept' ? 'accepted' : 'sent-back';
      run.reviewReason = input.reason ?? null;
      run.reviewedBy = actor.id;
      run.reviewedAt = new Date();
      await manager.getRepository(TestRunEntity).save(run);
      if (input.decision === 'send-back' && cell) {
        cell.state = 'needs-retest';
        cell.note = input.reason ?? null;
        cell.stateChangedAt = new Date();
        if (cell.runOfRecordId === run.id) cell.runOfRecordId = null;
        await manager.getRepository(MatrixCellEntity).save(cell);
      }
      await recordAction(manager, actor, `test-run.${input.decision}`, ['test-run', run.id], {
        reason: input.reason ?? null,
        flags: warnings.map((f) => f.code),
      });
      return run.id;
    });
  }

  async markRunOfRecord(actor: CurrentUser, runId: number) {
    return this.dataSource.transaction(async (manager) => {
      const run = await findRun(manager, runId);
      if (run.reviewState === 'sent-back') {
        throw new AppError(
          'run_sent_back',
          409,
          'A run that was sent back cannot stand for the cell. Choose another run.',
        );
      }
      await manager.getRepository(MatrixCellEntity).update({ id: run.matrixCellId }, { runOfRecordId: run.id });
      await recordAction(manager, actor, 'test-run.run-of-record', ['matrix-cell', run.matrixCellId], {
        runId: run.id,
      });
      return run.id;
    });
  }

  /** An editor's rubric for the roundup (null: the engine's defaults); every run is analysed again under it. */
  async setRubric(actor: CurrentUser, roundupId: number, rubric: VerdictRubric | null) {
    return this.dataSource.transaction(async (manager) => {
      const roundup = await manager
        .getRepository(RoundupEntity)
        .findOne({ where: { id: roundupId }, lock: { mode: 'pessimistic_write' } });
      if (!roundup) throw notFound('That roundup');
      roundup.verdictRubric = rubric;
      await manager.getRepository(RoundupEntity).save(roundup);
      const runs = await manager.getRepository(TestRunEntity).findBy({ roundupId });
      for (const run of runs) {
        const context = await this.cellContext(manager, run.matrixCellId);
        const previous = (await this.latestAnalyses(manager, [run.id])).get(run.id);
        const parameters = (previous?.parameters ?? {}) as { mapping?: ColumnMapping; options?: AnalysisOptionsInput };
        if (run.source === 'manual') {
          await this.insertAnalysis(
            manager,
            actor,
            run.id,
            { manual: true, options: { rubric: context.rubric, referenceRoomC: 21 } },
            manualAnalysis(
              {
                manualPeakC: Number(run.manualPeakC),
                manualAmbientC: Number(run.manualAmbientC),
                throttled: previous?.verdict === 'throttled',
              },
              context.rubric,
            ),
          );
        } else {
          await this.addAnalysisFromStore(manager, actor, run, context, parameters.mapping, parameters.options);
        }
      }
      await recordAction(manager, actor, 'roundup.rubric-changed', ['roundup', roundupId], {
        rubric,
        runsReanalysed: runs.length,
      });
      return runs.length;
    });
  }

  /** "Mark recorded" needs a submitted run on the cell. */
  static async assertCellHasRun(manager: EntityManager, cellId: number) {
    const count = await manager.getRepository(TestRunEntity).countBy({ matrixCellId: cellId });
    if (count === 0) {
      throw new AppError(
        'no_run',
        409,
        'Record a test run (a logger file or a manual entry) before marking the cell recorded.',
      );
    }
  }

  // ---- internals ----

  private rubricOf(roundup: RoundupEntity): VerdictRubric {
    return roundup.verdictRubric ? verdictRubricSchema.parse(roundup.verdictRubric) : defaultVerdictRubric;
  }

  private async cellContext(manager: EntityManager, cellId: number, lock = false) {
    const cell = await manager
      .getRepository(MatrixCellEntity)
      .findOne({ where: { id: cellId }, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) });
    if (!cell) throw notFound('That matrix cell');
    const roundup = await manager.getRepository(RoundupEntity).findOneByOrFail({ id: cell.roundupId });
    const entry = await manager.getRepository(RoundupEntryEntity).findOneByOrFail({ id: cell.entryId });
    const product = await manager.getRepository(ProductEntity).findOneByOrFail({ id: entry.productId });
    const configuration = await manager
      .getRepository(LoadConfigurationEntity)
      .findOneByOrFail({ id: cell.loadConfigurationId });
    const profile = roundup.benchProfileId
      ? await manager.getRepository(BenchProfileEntity).findOneBy({ id: roundup.benchProfileId })
      : null;
    return { cell, roundup, entry, product, configuration, profile, rubric: this.rubricOf(roundup) };
  }

  private async lockCellForRun(manager: EntityManager, actor: CurrentUser, cellId: number) {
    const context = await this.cellContext(manager, cellId, true);
    const { cell } = context;
    if (actor.role === 'tester' && cell.testerId !== actor.id) {
      throw forbidden('This cell is assigned to another tester; only they or an editor may record runs on it.');
    }
    if (!runnableStates.has(cell.state)) {
      throw new AppError(
        'cell_not_runnable',
        409,
        cell.state === 'accepted'
          ? 'This cell is accepted; ask the editor to send it back before adding a run.'
          : 'Assign this cell to a tester before recording runs on it.',
      );
    }
    return context;
  }

  /** The analysis request for a run: the tester's mapping and options, with the plan's own settings on top. */
  private analysisParameters(
    context: Awaited<ReturnType<TestRunsService['cellContext']>>,
    mapping: ColumnMapping | undefined,
    options: AnalysisOptionsInput | undefined,
  ) {
    const { profile, configuration, rubric } = context;
    return {
      mapping,
      options: {
        ...(options ?? {}),
        soakMinutes: configuration.soakMinutes,
        ...(profile
          ? { ambientTargetC: Number(profile.roomTempTargetC), ambientToleranceC: Number(profile.roomTempToleranceC) }
          : {}),
        rubric,
      },
    } satisfies AnalysisRequestInput;
  }

  private async bookingFor(
    manager: EntityManager,
    cell: MatrixCellEntity,
    input: { benchId?: number | null; startedAt: string; outsideBookingReason: string | null },
  ) {
    const startedAt = new Date(input.startedAt);
    const booking = await manager
      .createQueryBuilder(BenchBookingEntity, 'booking')
      .innerJoin(BenchBookingCellEntity, 'link', 'link.booking_id = booking.id')
      .where('link.matrix_cell_id = :cellId', { cellId: cell.id })
      .andWhere('booking.starts_at <= :at AND booking.ends_at > :at', { at: startedAt })
      .orderBy('booking.starts_at', 'DESC')
      .getOne();
    const benchId = input.benchId ?? booking?.benchId ?? null;
    if (benchId !== null && !(await manager.getRepository(BenchEntity).existsBy({ id: benchId }))) {
      throw new AppError('validation_failed', 400, 'Choose one of the lab’s benches.', { benchId: 'No such bench.' });
    }
    if (!booking && !input.outsideBookingReason) {
      throw new AppError(
        'outside_booking',
        409,
        'This run starts outside every booking of this cell. Check the start time, or give a reason to record it anyway.',
        { outsideBookingReason: 'Say why the run was made outside a booking.' },
      );
    }
    return { bookingId: booking?.id ?? null, benchId };
  }

  /**
   * A submitted run means the soak took place: a cell still waiting in the queue (assigned, or sent back for a retest)
   * is now running, so the tester can mark it recorded without first pressing Start. Only while the roundup is on the
   * bench, as for a start by hand; the move is kept in the roundup's history with the run that caused it.
   */
  private async startCellWithRun(
    manager: EntityManager,
    actor: CurrentUser,
    context: Awaited<ReturnType<TestRunsService['cellContext']>>,
    runId: number,
  ) {
    const { cell, roundup } = context;
    if (roundup.state !== 'on-the-bench' || !['assigned', 'needs-retest'].includes(cell.state)) return;
    await manager
      .getRepository(MatrixCellEntity)
      .update({ id: cell.id }, { state: 'running', stateChangedAt: new Date() });
    await recordPlanChange(manager, actor, roundup.id, 'roundup.cell_moved', {
      cellId: cell.id,
      action: 'start',
      from: cell.state,
      to: 'running',
      byRunId: runId,
    });
  }

  private async insertRun(
    manager: EntityManager,
    actor: CurrentUser,
    cell: MatrixCellEntity,
    input: ParsedLoggerRunRequest | ParsedManualRunRequest,
    booking: { bookingId: number | null; benchId: number | null },
    data: Partial<TestRunEntity>,
  ) {
    const repo = manager.getRepository(TestRunEntity);
    return repo.save(
      repo.create({
        matrixCellId: cell.id,
        roundupId: cell.roundupId,
        testerId: actor.role === 'tester' ? actor.id : (cell.testerId ?? actor.id),
        benchId: booking.benchId,
        benchBookingId: booking.bookingId,
        firmwareVersion: input.firmwareVersion,
        startedAt: new Date(input.startedAt),
        notes: input.notes,
        outsideBookingReason: booking.bookingId === null ? input.outsideBookingReason : null,
        reviewState: 'pending',
        submittedAt: new Date(),
        loggerFileId: null,
        manualPeakC: null,
        manualAmbientC: null,
        ...data,
      }),
    );
  }

  private async insertAnalysis(
    manager: EntityManager,
    actor: CurrentUser,
    runId: number,
    parameters: Record<string, unknown>,
    analysed: AnalysisResult | ManualResult,
  ) {
    const run = await manager.getRepository(TestRunEntity).findOneByOrFail({ id: runId });
    const calibration = await calibrationFlags(manager, run.benchId, run.startedAt);
    const result = calibration.length ? { ...analysed, flags: [...analysed.flags, ...calibration] } : analysed;
    const repo = manager.getRepository(RunAnalysisEntity);
    const fixed = (value: number | null | undefined, scale: number) => (value == null ? null : value.toFixed(scale));
    const full = 'throttle' in result ? (result as AnalysisResult) : null;
    await repo.save(
      repo.create({
        testRunId: runId,
        engineVersion: analysisEngineVersion,
        parameters,
        result: result as unknown as Record<string, unknown>,
        verdict: result.verdict?.code ?? null,
        peakC: fixed(result.peakC, 2),
        ambientC: fixed(result.ambientMeanC, 2),
        deltaOverAmbientC: fixed(result.deltaOverAmbientC, 2),
        normalisedPeakC: fixed(result.normalizedPeakC, 2),
        throttledS: full ? fixed(throttledSeconds(full), 1) : null,
        flagCodes: [...new Set(result.flags.map((f) => f.code))].join(',').slice(0, 500),
        createdBy: actor.id,
      }),
    );
  }

  private async addAnalysisFromStore(
    manager: EntityManager,
    actor: CurrentUser,
    run: TestRunEntity,
    context: Awaited<ReturnType<TestRunsService['cellContext']>>,
    mapping: ColumnMapping | undefined,
    options: AnalysisOptionsInput | undefined,
  ) {
    if (run.loggerFileId === null) {
      throw new AppError('manual_run', 409, 'A manual entry has no logger file to analyse again.');
    }
    const file = await manager.getRepository(StoredFileEntity).findOneByOrFail({ id: run.loggerFileId });
    const body = await this.files.get(file.storageKey);
    if (!body) throw new AppError('file_missing', 410, 'The stored file is missing from storage. Tell an admin.');
    const previous = (await this.latestAnalyses(manager, [run.id])).get(run.id);
    const before = (previous?.parameters ?? {}) as { mapping?: ColumnMapping; options?: AnalysisOptionsInput };
    const parameters = this.analysisParameters(context, mapping ?? before.mapping, options ?? before.options);
    const { analysis } = analysedOrThrow(await this.analyser(body, parameters));
    await this.insertAnalysis(manager, actor, run.id, parameters, analysis);
  }

  private async latestAnalyses(manager: EntityManager, runIds: number[]) {
    const latest = new Map<number, RunAnalysisEntity>();
    if (runIds.length === 0) return latest;
    const rows = await manager
      .getRepository(RunAnalysisEntity)
      .find({ where: { testRunId: In(runIds) }, order: { id: 'ASC' } });
    for (const row of rows) latest.set(row.testRunId, row);
    return latest;
  }

  private async runDtos(
    manager: EntityManager,
    runs: TestRunEntity[],
    cell: MatrixCellEntity,
    user: CurrentUser,
  ): Promise<TestRun[]> {
    if (runs.length === 0) return [];
    const ids = runs.map((r) => r.id);
    const analyses = await manager
      .getRepository(RunAnalysisEntity)
      .find({ where: { testRunId: In(ids) }, order: { id: 'ASC' } });
    const fileIds = runs.flatMap((r) => (r.loggerFileId === null ? [] : [r.loggerFileId]));
    const files = fileIds.length ? await manager.getRepository(StoredFileEntity).findBy({ id: In(fileIds) }) : [];
    const benchIds = runs.flatMap((r) => (r.benchId === null ? [] : [r.benchId]));
    const benches = benchIds.length ? await manager.getRepository(BenchEntity).findBy({ id: In(benchIds) }) : [];
    const people = await loadPeople(manager, [
      ...runs.flatMap((r) => [r.testerId, r.reviewedBy]),
      ...analyses.map((a) => a.createdBy),
    ]);
    const context = await this.cellContext(manager, cell.id);
    const vrmLoad = vrmLoadFor(context.product, context.configuration);
    return runs.map((run) => {
      const own = analyses.filter((a) => a.testRunId === run.id);
      const current = own.at(-1)!;
      const file = files.find((f) => f.id === run.loggerFileId);
      const bench = benches.find((b) => b.id === run.benchId);
      const actions: TestRun['actions'] = [];
      if (user.role === 'editor') {
        if (run.reviewState !== 'accepted') actions.push('accept');
        if (run.reviewState !== 'sent-back') actions.push('send-back');
        if (run.reviewState !== 'sent-back' && cell.runOfRecordId !== run.id) actions.push('mark-of-record');
      }
      if (run.source === 'logger' && (user.role === 'editor' || user.id === run.testerId)) actions.push('reanalyse');
      return {
        id: run.id,
        cellId: run.matrixCellId,
        roundupId: run.roundupId,
        tester: personOrNull(people, run.testerId)!,
        bench: bench ? { id: bench.id, name: bench.name } : null,
        bookingId: run.benchBookingId,
        firmwareVersion: run.firmwareVersion,
        startedAt: run.startedAt.toISOString(),
        notes: run.notes,
        source: run.source,
        loggerFile: file
          ? {
              id: file.id,
              originalName: file.originalName,
              byteSize: Number(file.byteSize),
              sha256: file.sha256,
              downloadUrl: `/api/runs/${run.id}/logger-file`,
            }
          : null,
        outsideBookingReason: run.outsideBookingReason,
        reviewState: run.reviewState,
        reviewReason: run.reviewReason,
        reviewedBy: personOrNull(people, run.reviewedBy),
        reviewedAt: run.reviewedAt?.toISOString() ?? null,
        submittedAt: run.submittedAt.toISOString(),
        isRunOfRecord: cell.runOfRecordId === run.id,
        analysis: analysisSummary(current, people),
        analyses: own.map((a) => analysisSummary(a, people)),
        vrmLoad,
        actions,
      };
    });
  }
}

/**
 * A QA flag for each probe or logger of the run's bench that was past its calibration when the run started (or was
 * never calibrated): its readings may be off by more than the tolerance the analysis assumes.
 */
/**
 * Runs are the work of one tester: a tester reads the runs they recorded and those of cells assigned to them,
 * never another tester's; editors, writers and admins read every run (results and write-ups need them).
 */
function assertMayReadRun(user: CurrentUser, run: TestRunEntity, cell: MatrixCellEntity) {
  if (run.testerId === user.id || mayReadCellRuns(user, cell.testerId)) return;
  throw forbidden('This run belongs to another tester; it is open to them and the editors.');
}

async function calibrationFlags(manager: EntityManager, benchId: number | null, startedAt: Date): Promise<QaFlag[]> {
  if (benchId === null) return [];
  const day = startedAt.toISOString().slice(0, 10);
  const instruments = await manager.getRepository(BenchInstrumentEntity).findBy({ benchId });
  return instruments.flatMap((instrument) => {
    const due = instrument.calibratedOn
      ? nextCalibrationDue(instrument.calibratedOn, instrument.calibrationIntervalMonths)
      : null;
    if (instrument.calibratedOn && !calibrationOverdue(due, day)) return [];
    return [
      {
        code: 'calibration-overdue' as const,
        label: qaFlagLabels['calibration-overdue'],
        severity: 'warning' as const,
        message: instrument.calibratedOn
          ? `The ${instrument.kind} “${instrument.label}” was due for calibration on ${due}, before this run.`
          : `The ${instrument.kind} “${instrument.label}” has no calibration on record.`,
        channel: null,
        atS: null,
      },
    ];
  });
}

function throttledSeconds(result: AnalysisResult) {
  return result.throttle.episodes.reduce((sum, episode) => sum + (episode.endS - episode.startS), 0);
}

type ManualResult = Pick<
  AnalysisResult,
  'peakC' | 'ambientMeanC' | 'deltaOverAmbientC' | 'normalizedPeakC' | 'referenceRoomC' | 'flags' | 'verdict'
> & { manual: true };

/** A manual entry judged by the same rubric; its flag says no log backs it. */
function manualAnalysis(
  input: { manualPeakC: number; manualAmbientC: number; throttled: boolean },
  rubric: VerdictRubric,
): ManualResult {
  const referenceRoomC = 21; // controlled room near 21 °C: common practice, no source (REFERENCES.md)
  const deltaOverAmbientC = input.manualPeakC - input.manualAmbientC;
  return {
    manual: true,
    peakC: input.manualPeakC,
    ambientMeanC: input.manualAmbientC,
    deltaOverAmbientC,
    normalizedPeakC: referenceRoomC + deltaOverAmbientC,
    referenceRoomC,
    flags: [
      {
        code: 'manual-entry',
        label: qaFlagLabels['manual-entry'],
        severity: 'warning',
        message: 'Entered by hand: no logger file backs these figures.',
        channel: null,
        atS: null,
      },
    ],
    verdict: judgeRun(
      {
        peakC: input.manualPeakC,
        normalizedPeakC: referenceRoomC + deltaOverAmbientC,
        referenceRoomC,
        useNormalizedPeak: false,
        throttled: input.throttled,
        throttleSource: input.throttled ? 'manual' : 'none',
        firstThrottleAtS: null,
        unstable: false,
      },
      rubric,
    ),
  };
}

function analysisSummary(
  row: RunAnalysisEntity,
  people: Map<number, { id: number; displayName: string }>,
): RunAnalysisSummary {
  const result = row.result as {
    flags?: QaFlag[];
    verdict?: { label?: string; rule?: string; status?: RunAnalysisSummary['verdictStatus'] };
  };
  return {
    id: row.id,
    engineVersion: row.engineVersion,
    createdAt: row.createdAt.toISOString(),
    createdBy: personOrNull(people, row.createdBy) ?? { id: row.createdBy, displayName: 'Former staff' },
    verdict: (row.verdict as RunAnalysisSummary['verdict']) ?? null,
    verdictStatus: result.verdict?.status ?? null,
    verdictLabel: result.verdict?.label ?? null,
    verdictRule: result.verdict?.rule ?? null,
    peakC: toNumber(row.peakC),
    ambientC: toNumber(row.ambientC),
    deltaOverAmbientC: toNumber(row.deltaOverAmbientC),
    normalisedPeakC: toNumber(row.normalisedPeakC),
    throttledS: toNumber(row.throttledS),
    flags: result.flags ?? [],
    parameters: row.parameters,
  };
}

/**
 * VRM electrical load for a run from the load configuration's package power and core voltage and the board's power
 * design; null when the catalog lacks a figure it needs.
 */
function vrmLoadFor(product: ProductEntity, configuration: LoadConfigurationEntity): VrmLoadFigures | null {
  if (
    product.controllerPhases === null ||
    product.phaseMultiplication === null ||
    product.stagesPerPhase === null ||
    product.vcoreStageCurrentA === null
  ) {
    return null;
  }
  try {
    const packagePowerW = Number(configuration.expectedPackagePowerW);
    const coreVoltageV = Number(configuration.coreVoltageV);
    const stageRatingA = Number(product.vcoreStageCurrentA);
    const load = vrmElectricalLoad({
      packagePowerW,
      coreVoltageV,
      controllerPhases: product.controllerPhases,
      multiplication: product.phaseMultiplication as PhaseMultiplication,
      stagesPerPhase: product.stagesPerPhase,
      stageRatingA,
    });
    return {
      packagePowerW,
      coreVoltageV,
      coreCurrentA: load.coreCurrentA,
      effectivePhases: load.effectivePhases,
      totalStages: load.totalStages,
      currentPerPhaseA: load.currentPerPhaseA,
      currentPerStageA: load.currentPerStageA,
      stageRatingA,
      stageLoadPercent: load.stageLoadPercent,
      assumption:
        'All package power is taken as core-rail power (an upper bound on the current) and shared evenly by every phase and power stage, as in an ideally balanced multiphase regulator.',
    };
  } catch {
    return null;
  }
}

/** The test run, or 404; `lock` holds it until the transaction ends. */
async function findRun(manager: EntityManager, runId: number, lock = false): Promise<TestRunEntity> {
  const run = await manager
    .getRepository(TestRunEntity)
    .findOne({ where: { id: runId }, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) });
  if (!run) throw notFound('That test run');
  return run;
}

/** The run with its cell, once the user may read the run (a tester: their own runs). */
async function readableRun(manager: EntityManager, runId: number, user: CurrentUser) {
  const run = await findRun(manager, runId);
  const cell = await manager.getRepository(MatrixCellEntity).findOneByOrFail({ id: run.matrixCellId });
  assertMayReadRun(user, run, cell);
  return { run, cell };
}
