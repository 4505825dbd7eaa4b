import { In, type DataSource } from 'typeorm';
import { ReaderSiteSettingsEntity } from '../entities/reader-site-settings.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { WriteUpSectionEntity } from '../entities/write-up-section.entity';
import type { WriteUpsService } from '../services/write-ups.service';
import { publicPaths } from './public-paths';
import {
  buildPublishedRoundup,
  defaultOpenDataLicence,
  publicRoundupStates,
  type PublishedRoundup,
} from './published-roundup';

/**
 * Where reader pages get published roundups from. The live source builds them from the database for roundups that
 * are Live or Updated; a snapshot source (frozen at publication) can take its place without the pages changing.
 */
export interface PublishedRoundupSource {
  /** Every published roundup, newest publication first. */
  list(): Promise<PublishedRoundup[]>;
  /** One published roundup, or null when it is not on the public site (unknown, or not yet published). */
  get(roundupId: number): Promise<PublishedRoundup | null>;
}

export interface ReaderSiteSettings {
  outletName: string;
  openDataLicence: string;
}

export const defaultOutletName = 'Benchwire results';

export async function loadReaderSiteSettings(dataSource: DataSource): Promise<ReaderSiteSettings> {
  const row = await dataSource.getRepository(ReaderSiteSettingsEntity).findOneBy({ id: 1 });
  return {
    outletName: row?.outletName ?? defaultOutletName,
    openDataLicence: row?.openDataLicence ?? defaultOpenDataLicence,
  };
}

/**
 * The write-up sections an editor signed off, rendered by the editorial renderer with public photo addresses: only
 * signed-off text reaches readers. A roundup without sections (none were ever written) gets none, and reading never
 * creates them.
 */
export async function signedOffWriteUp(
  dataSource: DataSource,
  writeUps: Pick<WriteUpsService, 'renderedSections'> | undefined,
  roundupId: number,
) {
  const byEntry = new Map<number, string>();
  const sections: { introductionHtml?: string; methodologyHtml?: string; conclusionHtml?: string } = {};
  if (!writeUps) return { byEntry, sections };
  const rows = await dataSource.getRepository(WriteUpSectionEntity).findBy({ roundupId });
  if (rows.length === 0) return { byEntry, sections };
  const rendered = await writeUps.renderedSections(roundupId, (photoId, width, format) =>
    publicPaths.photo(photoId, width, format),
  );
  for (const section of rendered.sections) {
    if (section.reviewState !== 'signed-off') continue;
    const row = rows.find((r) => r.id === section.id);
    if (section.kind === 'product' && row?.entryId) byEntry.set(row.entryId, section.html);
    if (section.kind === 'introduction') sections.introductionHtml = section.html;
    if (section.kind === 'methodology') sections.methodologyHtml = section.html;
    if (section.kind === 'conclusion') sections.conclusionHtml = section.html;
  }
  return { byEntry, sections };
}

/** Builds published roundups on request from the live data of roundups in the Live or Updated state. */
export class LivePublishedRoundups implements PublishedRoundupSource {
  constructor(
    private readonly dataSource: DataSource,
    private readonly writeUps?: Pick<WriteUpsService, 'renderedSections'>,
  ) {}

  private async build(roundup: RoundupEntity, licence: string): Promise<PublishedRoundup> {
    const written = await signedOffWriteUp(this.dataSource, this.writeUps, roundup.id);
    return buildPublishedRoundup(this.dataSource.manager, roundup.id, {
      publishedAt: roundup.stateChangedAt,
      licence,
      writeUps: written.byEntry,
      writeUpSections: written.sections,
    });
  }

  async list(): Promise<PublishedRoundup[]> {
    const roundups = await this.dataSource.getRepository(RoundupEntity).find({
      where: { state: In([...publicRoundupStates]) },
      order: { stateChangedAt: 'DESC', id: 'DESC' },
    });
    const { openDataLicence } = await loadReaderSiteSettings(this.dataSource);
    const models: PublishedRoundup[] = [];
    for (const roundup of roundups) models.push(await this.build(roundup, openDataLicence));
    return models;
  }

  async get(roundupId: number): Promise<PublishedRoundup | null> {
    const roundup = await this.dataSource.getRepository(RoundupEntity).findOneBy({ id: roundupId });
    if (!roundup || !publicRoundupStates.includes(roundup.state)) return null;
    const { openDataLicence } = await loadReaderSiteSettings(this.dataSource);
    return this.build(roundup, openDataLicence);
  }
}

/** The open-data choices that apply now: raw logger files per roundup (the editor's switch) and the licence line. */
export interface OpenDataSettings {
  licence: string;
  rawFilesAllowed: Map<number, boolean>;
}

export async function loadOpenDataSettings(dataSource: DataSource, roundupIds: number[]): Promise<OpenDataSettings> {
  const { openDataLicence } = await loadReaderSiteSettings(dataSource);
  const rows = roundupIds.length
    ? await dataSource.getRepository(RoundupEntity).find({
        where: { id: In(roundupIds) },
        select: { id: true, openDataRawFiles: true },
      })
    : [];
  return { licence: openDataLicence, rawFilesAllowed: new Map(rows.map((r) => [r.id, r.openDataRawFiles === true])) };
}

/**
 * A published model with today's open-data choices: the licence line and whether raw logger files are offered are
 * settings of the outlet and the editor, not published data, so they apply at once (the snapshot pages are rendered
 * again when they change). A file left out here is not offered, listed or served.
 */
export function withOpenDataSettings(model: PublishedRoundup, settings: OpenDataSettings): PublishedRoundup {
  const rawFilesAllowed = settings.rawFilesAllowed.get(model.roundupId) ?? false;
  return {
    ...model,
    results: rawFilesAllowed ? model.results : model.results.map((r) => (r.rawFile ? { ...r, rawFile: null } : r)),
    openData: { ...model.openData, rawFilesAllowed, licence: settings.licence.trim() || defaultOpenDataLicence },
  };
}

/**
 * Published roundups as frozen at their latest publication (`publishing.publishedModels()`), for every reader page the
 * snapshot does not hold (product pages, compare, open data, photos, pages with a query): an edit after publication
 * reaches them only when an update is published, and a roundup without a publication record is on none of them.
 * Parsed models are kept until a publication is added (publications are only ever inserted).
 */
export class SnapshotPublishedRoundups implements PublishedRoundupSource {
  private cached: { key: string; models: PublishedRoundup[] } | null = null;

  constructor(
    private readonly dataSource: DataSource,
    private readonly publishedModels: () => Promise<PublishedRoundup[]>,
  ) {}

  private async models(): Promise<PublishedRoundup[]> {
    const [row] = (await this.dataSource.query(
      'SELECT COUNT(*) AS n, COALESCE(MAX(id), 0) AS last FROM roundup_publications',
    )) as { n: number | string; last: number | string }[];
    const key = `${row?.n}:${row?.last}`;
    if (this.cached?.key !== key) this.cached = { key, models: await this.publishedModels() };
    const models = this.cached.models;
    const settings = await loadOpenDataSettings(
      this.dataSource,
      models.map((m) => m.roundupId),
    );
    return models.map((model) => withOpenDataSettings(model, settings));
  }

  list(): Promise<PublishedRoundup[]> {
    return this.models();
  }

  async get(roundupId: number): Promise<PublishedRoundup | null> {
    return (await this.models()).find((m) => m.roundupId === roundupId) ?? null;
  }
}
