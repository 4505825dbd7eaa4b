import { In, type DataSource } from 'typeorm';
import { ReaderSiteSettingsEntity } from '../entities/reader-site-settings.entity';
import { RoundupEntity } from '../entities/roundup.entity';
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

/** Builds published roundups on request from the live data of roundups in the Live or Updated state. */
export class LivePublishedRoundups implements PublishedRoundupSource {
  constructor(private readonly dataSource: DataSource) {}

  private async build(roundup: RoundupEntity, licence: string): Promise<PublishedRoundup> {
    return buildPublishedRoundup(this.dataSource.manager, roundup.id, {
      publishedAt: roundup.stateChangedAt,
      licence,
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
