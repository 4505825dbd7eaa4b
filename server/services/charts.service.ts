import { createHash } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { RoundupChartEntity } from '../entities/roundup-chart.entity';
import { StoredFileEntity } from '../entities/stored-file.entity';
import { AppError, conflict, invalid, notFound } from '../errors';
import { loadPeople, personOrNull } from '../mappers/people';
import { renderChartPng } from '../charts/render-chart-png';
import { loadEditorialFacts, type EditorialFacts } from '../lib/editorial-facts';
import { lockRoundup } from '../lib/roundup-access';
import { recordPlanChange } from '../lib/roundup-audit';
import type { FileStore } from '../storage/file-store';
import { assertEditorialState, editorialStates } from './verdicts.service';
import {
  chartFor,
  chartKeysOf,
  chartMetricNames,
  defaultChartSettings,
  describeChartChanges,
  parseChartKey,
  type ChartData,
  type ChartSettings,
} from '../../shared/domain/editorial/chart-data';
import { chartImageSize } from '../../shared/domain/editorial/chart-drawing';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { RoundupChart, RoundupCharts } from '../../shared/schemas/charts';

/** What an approval freezes: the editor's settings, the data exactly as drawn, and the palette it is drawn in. */
interface ChartSnapshot {
  settings: ChartSettings;
  data: ChartData;
  palette: 'light';
}

function snapshotOf(settings: ChartSettings, data: ChartData): ChartSnapshot {
  return { settings, data, palette: 'light' };
}

function hashOf(snapshot: ChartSnapshot): string {
  return createHash('sha256').update(JSON.stringify(snapshot)).digest('hex');
}

function settingsChanges(before: ChartSettings, after: ChartSettings): string[] {
  const changes: string[] = [];
  if (before.metric !== after.metric) changes.push(`The metric changed to ${chartMetricNames[after.metric]}.`);
  if (JSON.stringify(before.referenceEntryIds) !== JSON.stringify(after.referenceEntryIds)) {
    changes.push('The choice of reference products changed.');
  }
  if (before.loadConfigurationId !== after.loadConfigurationId) changes.push('The plotted load configuration changed.');
  return changes;
}

/** An approved chart's stored image, for the reader site and the mail. */
export interface ApprovedChartImage {
  key: string;
  title: string;
  storageKey: string;
  sha256: string;
  width: number;
  height: number;
  /** True when an underlying value changed after approval: the image shows what was approved, not today's data. */
  stale: boolean;
}

interface ChartState {
  key: string;
  settings: ChartSettings;
  data: ChartData;
  hash: string;
  row: RoundupChartEntity | undefined;
  status: RoundupChart['status'];
  changes: string[];
}

/**
 * The roundup's comparison charts: computed from the runs of record (shared/domain/editorial/chart-data), the
 * editor's settings per chart, approval that freezes a snapshot and renders the PNG, and staleness when anything
 * underneath changes after approval.
 */
export class ChartsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly files: FileStore,
  ) {}

  /** Every chart of the roundup with its current data and approval status. */
  async states(manager: EntityManager, facts: EditorialFacts): Promise<ChartState[]> {
    const rows = await manager.getRepository(RoundupChartEntity).findBy({ roundupId: facts.roundup.id });
    return chartKeysOf(facts.sources).map((key) => {
      const row = rows.find((r) => r.chartKey === key);
      const settings = { ...defaultChartSettings, ...(row?.settings ?? {}) };
      const data = chartFor(facts.sources, key, settings) as ChartData;
      const hash = hashOf(snapshotOf(settings, data));
      const values = data.kind === 'price-scatter' ? data.points : data.bars;
      let status: RoundupChart['status'] = 'not-approved';
      let changes: string[] = [];
      if (row?.approvedHash) {
        if (row.approvedHash === hash) status = 'approved';
        else {
          status = 'stale';
          const approved = row.approvedSnapshot as unknown as ChartSnapshot;
          changes = [...settingsChanges(approved.settings, settings), ...describeChartChanges(approved.data, data)];
          if (changes.length === 0) changes.push('The chart’s data changed.');
        }
      } else if (values.length === 0) status = 'empty';
      return { key, settings, data, hash, row, status, changes };
    });
  }

  async list(roundupId: number): Promise<RoundupCharts> {
    const manager = this.dataSource.manager;
    const facts = await loadEditorialFacts(manager, roundupId);
    const states = await this.states(manager, facts);
    const people = await loadPeople(
      manager,
      states.map((s) => s.row?.approvedBy ?? null),
    );
    const files = states.some((s) => s.row?.imageFileId)
      ? await manager
          .getRepository(StoredFileEntity)
          .findBy(states.flatMap((s) => (s.row?.imageFileId ? [{ id: s.row.imageFileId }] : [])))
      : [];
    return {
      roundupId,
      editable: editorialStates.includes(facts.roundup.state),
      loadConfigurations: facts.configurations.map((c) => ({ id: c.id, name: c.name })),
      charts: states.map((state) => {
        const parsed = parseChartKey(state.key);
        const row = state.row;
        const file = files.find((f) => f.id === row?.imageFileId);
        return {
          key: state.key,
          kind: state.data.kind,
          title: state.data.title,
          settings: state.settings,
          data: state.data,
          snapshotHash: state.hash,
          status: state.status,
          approval:
            row?.approvedAt && row.approvedSnapshot
              ? {
                  approvedBy: personOrNull(people, row.approvedBy),
                  approvedAt: row.approvedAt.toISOString(),
                  imageUrl: file ? `/api/roundups/${roundupId}/charts/${state.key}/image.png` : null,
                  imageSha256: file?.sha256 ?? null,
                  data: (row.approvedSnapshot as unknown as ChartSnapshot).data,
                }
              : null,
          changes: state.changes,
          referenceChoices:
            parsed?.kind === 'configuration'
              ? facts.references.map((reference) => ({
                  entryId: reference.entry.id,
                  productName: reference.name,
                  roundupTitle: reference.roundupTitle,
                  measured: facts.sources.referenceRuns.some(
                    (r) => r.entryId === reference.entry.id && r.loadConfigurationId === parsed.id,
                  ),
                }))
              : [],
        };
      }),
    };
  }

  /** The editor's settings for a chart: metric, references (configuration charts), configuration (scatter). */
  async updateSettings(
    actor: CurrentUser,
    roundupId: number,
    key: string,
    settings: ChartSettings,
  ): Promise<RoundupCharts> {
    await this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId);
      assertEditorialState(roundup.state);
      const facts = await loadEditorialFacts(manager, roundupId);
      const parsed = this.chartKeyIn(facts, key);
      const referenceIds = facts.references.map((r) => r.entry.id);
      const fields: Record<string, string> = {};
      (settings.referenceEntryIds ?? []).forEach((id, index) => {
        if (!referenceIds.includes(id))
          fields[`referenceEntryIds.${index}`] = 'Not a reference product of this roundup.';
      });
      if (settings.referenceEntryIds !== null && parsed.kind !== 'configuration') {
        fields.referenceEntryIds = 'Only a load configuration’s chart shows reference products.';
      }
      if (settings.loadConfigurationId !== null) {
        if (parsed.kind !== 'price-scatter')
          fields.loadConfigurationId = 'Only the price scatter picks a load configuration.';
        else if (!facts.configurations.some((c) => c.id === settings.loadConfigurationId)) {
          fields.loadConfigurationId = 'That load configuration is not in this roundup’s plan.';
        }
      }
      if (Object.keys(fields).length > 0) throw invalid('Some chart settings do not fit this chart.', fields);
      const repo = manager.getRepository(RoundupChartEntity);
      const row = await repo.findOneBy({ roundupId, chartKey: key });
      const normalised: ChartSettings = {
        metric: settings.metric,
        referenceEntryIds:
          settings.referenceEntryIds === null ? null : [...new Set(settings.referenceEntryIds)].sort((a, b) => a - b),
        loadConfigurationId: settings.loadConfigurationId,
      };
      if (row) await repo.update({ id: row.id }, { settings: normalised });
      else await repo.insert({ roundupId, chartKey: key, settings: normalised });
      await recordPlanChange(manager, actor, roundupId, 'chart.settings_changed', {
        chart: key,
        from: row?.settings ?? defaultChartSettings,
        to: normalised,
      });
    });
    return this.list(roundupId);
  }

  /**
   * Approves the chart as drawn now: freezes its settings and data, renders the PNG into the file store with its
   * hash, and records who approved it. `expectedHash` is the hash of the chart the editor looked at; when the chart
   * changed since, approval is refused with 409 so nobody approves what they have not seen.
   */
  async approve(actor: CurrentUser, roundupId: number, key: string, expectedHash?: string): Promise<RoundupCharts> {
    await this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId);
      assertEditorialState(roundup.state);
      const facts = await loadEditorialFacts(manager, roundupId);
      this.chartKeyIn(facts, key);
      const state = (await this.states(manager, facts)).find((s) => s.key === key) as ChartState;
      if (expectedHash && expectedHash !== state.hash) {
        throw conflict('chart_changed', 'The chart changed since you opened it. Look at it again, then approve.');
      }
      if (state.status === 'empty') {
        throw new AppError('chart_empty', 422, 'This chart has nothing to draw yet, so there is nothing to approve.');
      }
      const png = await renderChartPng(state.data, chartImageSize);
      const sha256 = createHash('sha256').update(png).digest('hex');
      const storageKey = `charts/roundup-${roundupId}/${key}-${sha256.slice(0, 16)}.png`;
      await this.files.put(storageKey, png, 'image/png');
      const fileRepo = manager.getRepository(StoredFileEntity);
      const existingFile = await fileRepo.findOneBy({ storageKey });
      const fileId =
        existingFile?.id ??
        Number(
          (
            await fileRepo.insert({
              storageKey,
              sha256,
              byteSize: String(png.length),
              contentType: 'image/png',
              originalName: `${key}.png`,
              uploadedBy: actor.id,
            })
          ).identifiers[0].id,
        );
      const snapshot = snapshotOf(state.settings, state.data);
      const values = {
        approvedSnapshot: snapshot as unknown as Record<string, unknown>,
        approvedHash: state.hash,
        approvedBy: actor.id,
        approvedAt: new Date(),
        imageFileId: fileId,
      };
      const repo = manager.getRepository(RoundupChartEntity);
      const row = state.row ?? repo.create({ roundupId, chartKey: key, settings: state.settings });
      await repo.save(Object.assign(row, values));
      await recordPlanChange(manager, actor, roundupId, 'chart.approved', {
        chart: key,
        title: state.data.title,
        snapshotHash: state.hash,
        imageSha256: sha256,
        wasStale: state.status === 'stale',
        changes: state.changes,
      });
    });
    return this.list(roundupId);
  }

  /** The approved chart's PNG as stored. */
  async image(roundupId: number, key: string): Promise<{ body: Buffer; sha256: string }> {
    const manager = this.dataSource.manager;
    const row = await manager.getRepository(RoundupChartEntity).findOneBy({ roundupId, chartKey: key });
    if (!row?.imageFileId) throw notFound('An approved image of that chart');
    const file = await manager.getRepository(StoredFileEntity).findOneByOrFail({ id: row.imageFileId });
    const body = await this.files.get(file.storageKey);
    if (!body)
      throw new AppError('file_missing', 410, 'The chart image is missing from storage. Approve the chart again.');
    return { body, sha256: file.sha256 };
  }

  /**
   * The approved images of a roundup's charts, in the charts screen's order, for the reader site (social preview) and
   * the mail: each with its file-store key, hash and size, and whether it has gone stale since.
   */
  async approvedChartImages(roundupId: number): Promise<ApprovedChartImage[]> {
    const manager = this.dataSource.manager;
    const facts = await loadEditorialFacts(manager, roundupId);
    const states = await this.states(manager, facts);
    const out: ApprovedChartImage[] = [];
    for (const state of states) {
      if (!state.row?.imageFileId || !state.row.approvedSnapshot) continue;
      const file = await manager.getRepository(StoredFileEntity).findOneByOrFail({ id: state.row.imageFileId });
      out.push({
        key: state.key,
        title: (state.row.approvedSnapshot as unknown as ChartSnapshot).data.title,
        storageKey: file.storageKey,
        sha256: file.sha256,
        width: chartImageSize.width,
        height: chartImageSize.height,
        stale: state.status === 'stale',
      });
    }
    return out;
  }

  private chartKeyIn(facts: EditorialFacts, key: string) {
    const parsed = parseChartKey(key);
    if (!parsed || !chartKeysOf(facts.sources).includes(key)) throw notFound('That chart in this roundup');
    return parsed;
  }
}
