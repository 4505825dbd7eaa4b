import { In, type EntityManager } from 'typeorm';
import { MailingEntity } from '../entities/mail.entities';
import { EditorialVerdictEntity } from '../entities/editorial-verdict.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { RoundupPublicationEntity } from '../entities/roundup-publication.entity';
import { WriteUpSectionEntity } from '../entities/write-up-section.entity';
import { productBriefs } from '../mappers/product-fields';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import { editorialLabelNames, editorialLabels } from '../../shared/domain/editorial/editorial-labels';
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

/** Top picks in a mail: at most this many labelled products. */
const maxPicks = 5;
/** A summary longer than this is cut at a word boundary. */
const maxSummary = 600;

/** The plain text of the first paragraph of a write-up document (Tiptap JSON), or null. */
export function firstParagraphText(document: unknown): string | null {
  const textOf = (node: unknown): string => {
    if (!node || typeof node !== 'object') return '';
    const { text, content } = node as { text?: unknown; content?: unknown };
    if (typeof text === 'string') return text;
    return Array.isArray(content) ? content.map(textOf).join('') : '';
  };
  const find = (node: unknown): string | null => {
    if (!node || typeof node !== 'object') return null;
    const { type, content } = node as { type?: unknown; content?: unknown };
    if (type === 'paragraph') {
      const text = textOf(node).replace(/\s+/g, ' ').trim();
      return text || null;
    }
    if (!Array.isArray(content)) return null;
    for (const child of content) {
      const found = find(child);
      if (found) return found;
    }
    return null;
  };
  return find(document);
}

function shorten(text: string, max: number): string {
  if (text.length <= max) return text;
  const cut = text.slice(0, max - 1);
  return `${cut.slice(0, Math.max(cut.lastIndexOf(' '), max / 2))}…`;
}

/**
 * The summary readers see first: the published standfirst, else the first paragraph of the signed-off introduction,
 * else a sentence of facts (boards tested, platform, loads).
 */
async function summaryOf(manager: EntityManager, roundup: RoundupEntity, testedCount: number): Promise<string> {
  const publication = await manager
    .getRepository(RoundupPublicationEntity)
    .findOne({ where: { roundupId: roundup.id }, order: { version: 'DESC' } });
  const standfirst = (publication?.model as { standfirst?: unknown } | undefined)?.standfirst;
  if (typeof standfirst === 'string' && standfirst.trim()) return shorten(standfirst.trim(), maxSummary);
  const introduction = await manager
    .getRepository(WriteUpSectionEntity)
    .findOneBy({ roundupId: roundup.id, kind: 'introduction', reviewState: 'signed-off' });
  const paragraph = introduction ? firstParagraphText(introduction.content) : null;
  if (paragraph) return shorten(paragraph, maxSummary);
  const loads = await manager.getRepository(RoundupLoadConfigurationEntity).countBy({ roundupId: roundup.id });
  const boards = `${testedCount} ${roundup.platform} ${testedCount === 1 ? 'board' : 'boards'}`;
  return `${boards} tested for power-delivery temperatures${loads ? ` under ${loads} ${loads === 1 ? 'load' : 'loads'}` : ''}, with every run as open data.`;
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
  const verdicts = entries.length
    ? await manager.getRepository(EditorialVerdictEntity).findBy({ entryId: In(entries.map((e) => e.id)) })
    : [];
  const labelOf = new Map(verdicts.map((v) => [v.entryId, v.label]));
  // Top picks: the labelled products, strongest label first, then in the roundup's order.
  const picks = entries
    .filter((entry) => labelOf.has(entry.id))
    .map((entry, order) => ({ entry, order, rank: editorialLabels.indexOf(labelOf.get(entry.id)!) }))
    .sort((a, b) => a.rank - b.rank || a.order - b.order)
    .slice(0, maxPicks)
    .map(({ entry }) => ({ product: products.get(entry.productId), label: labelOf.get(entry.id)! }))
    .filter((p): p is { product: NonNullable<typeof p.product>; label: (typeof p)['label'] } => Boolean(p.product))
    .map(({ product, label }) => ({ name: productDisplayName(product), label: editorialLabelNames[label] }));
  return {
    kind: mailing.kind,
    roundupTitle: roundup.title,
    summary: await summaryOf(manager, roundup, entries.length),
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
