import type { DataSource } from 'typeorm';
import { ReaderSiteSettingsEntity } from '../entities/reader-site-settings.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { findRoundup, lockRoundup } from '../lib/roundup-access';
import { buildPublishedRoundup } from '../public-site/published-roundup';
import { defaultOutletName, loadReaderSiteSettings } from '../public-site/published-roundup-source';
import { recordAction } from '../services/audit.service';
import type { PublishingService } from '../services/publishing.service';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { OpenDataSettings, OpenDataSettingsRequest } from '../../shared/schemas/publishing';

/**
 * The open-data switches staff set (editors and admins): whether a roundup's raw logger files are downloadable, and
 * the outlet's licence line. They are settings, not published data: published pages follow them at once (the snapshot
 * is rendered again), and no update needs publishing.
 */
export class OpenDataSettingsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly publishing: Pick<PublishingService, 'rerenderAll'>,
  ) {}

  async get(roundupId: number): Promise<OpenDataSettings> {
    const roundup = await findRoundup(this.dataSource.manager, roundupId);
    const { openDataLicence } = await loadReaderSiteSettings(this.dataSource);
    // The files that would be offered: runs of record of this roundup with a logger file.
    const model = await buildPublishedRoundup(this.dataSource.manager, roundupId, {
      publishedAt: new Date(),
      rawFilesAllowed: true,
    });
    return {
      roundupId,
      rawFilesAllowed: roundup.openDataRawFiles === true,
      licence: openDataLicence,
      rawFileCount: model.results.filter((r) => r.rawFile).length,
    };
  }

  async set(actor: CurrentUser, roundupId: number, input: OpenDataSettingsRequest): Promise<OpenDataSettings> {
    await this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId);
      const settings = manager.getRepository(ReaderSiteSettingsEntity);
      const current = await settings.findOneBy({ id: 1 });
      if (roundup.openDataRawFiles !== input.rawFilesAllowed) {
        await manager
          .getRepository(RoundupEntity)
          .update({ id: roundupId }, { openDataRawFiles: input.rawFilesAllowed });
      }
      if (current?.openDataLicence !== input.licence) {
        await settings.save({
          id: 1,
          outletName: current?.outletName ?? defaultOutletName,
          openDataLicence: input.licence,
        });
      }
      await recordAction(manager, actor, 'roundup.open_data_changed', ['roundup', roundupId], {
        rawFilesAllowed: input.rawFilesAllowed,
        previousRawFilesAllowed: roundup.openDataRawFiles === true,
        licence: input.licence,
        previousLicence: current?.openDataLicence ?? null,
      });
    });
    // Published pages show the open data as it is now set.
    await this.publishing.rerenderAll();
    return this.get(roundupId);
  }
}
