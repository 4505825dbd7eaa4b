import { In, type EntityManager } from 'typeorm';
import { MailingEntity } from '../entities/mail.entities';
import { RoundupEntity } from '../entities/roundup.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { productBriefs } from '../mappers/product-fields';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import type { GoLiveContent } from './compose';
import { publicPaths } from '../public-site/public-paths';

/** Where readers find a published roundup (the reader site's address for it). */
export function publicRoundupUrl(siteUrl: string, roundup: { id: number; title: string }): string {
  return `${siteUrl}${publicPaths.roundup(roundup.id, roundup.title)}`;
}

export interface ContentSettings {
  siteUrl: string;
  outletName: string;
  /** The main chart of a published roundup as PNG, when the chart renderer has one. */
  chartPng?: (manager: EntityManager, roundupId: number) => Promise<{ png: Buffer; alt: string } | null>;
}

/** What a mailing about a roundup says: its title, summary, top picks with their labels, main chart and link. */
export async function loadMailingContent(
  manager: EntityManager,
  mailing: Pick<MailingEntity, 'roundupId' | 'note'> & { kind: GoLiveContent['kind'] },
  settings: ContentSettings,
): Promise<GoLiveContent> {
  const roundup = await manager.getRepository(RoundupEntity).findOneByOrFail({ id: mailing.roundupId });
  const entries = await manager
    .getRepository(RoundupEntryEntity)
    .find({ where: { roundupId: roundup.id, kind: 'tested' }, order: { position: 'ASC', id: 'ASC' } });
  const products = entries.length
    ? await productBriefs(
        manager,
        entries.map((e) => e.productId),
      )
    : new Map();
  const picks = entries
    .slice(0, 5)
    .map((entry) => products.get(entry.productId))
    .filter((p): p is NonNullable<typeof p> => Boolean(p))
    .map((product) => ({ name: productDisplayName(product), label: null }));
  return {
    kind: mailing.kind,
    roundupTitle: roundup.title,
    summary: null,
    picks,
    chart: settings.chartPng ? await settings.chartPng(manager, roundup.id) : null,
    url: publicRoundupUrl(settings.siteUrl, roundup),
    note: mailing.note,
    outletName: settings.outletName,
  };
}

export async function mailingsById(manager: EntityManager, ids: number[]) {
  const rows = ids.length ? await manager.getRepository(MailingEntity).findBy({ id: In(ids) }) : [];
  return new Map(rows.map((m) => [m.id, m]));
}
