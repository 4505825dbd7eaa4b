import { In, type EntityManager } from 'typeorm';
import { ProductEntity } from '../entities/product.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import type { FrozenRoundup, PublicSiteRenderer, PublishedNote, RenderedPage } from './public-site-renderer';

// A deliberately small renderer that publishing uses until the reader site's renderers (server/public-site) take
// its place through the PublicSiteRenderer interface: a home page, one page per roundup and per board, a feed, a
// sitemap and robots.txt, so every public surface exists only once something is published.

export interface StandInModel extends FrozenRoundup {
  title: string;
  platform: string;
  products: { productId: number; name: string; path: string }[];
}

const readerBase = '/read';

function slugify(text: string): string {
  return (
    text
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 80) || 'item'
  );
}

const escapes: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
const escape = (text: string) => text.replace(/[&<>"']/g, (c) => escapes[c]);

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escape(title)}</title>
</head>
<body>
<main>
${body}
</main>
</body>
</html>
`;
}

function notesList(notes: PublishedNote[]): string {
  if (notes.length === 0) return '';
  const items = notes
    .map(
      (n) =>
        `<li><time datetime="${n.at}">${n.at.slice(0, 10)}</time> ${n.kind === 'correction' ? 'Correction' : 'Update'}: ${escape(n.note)}</li>`,
    )
    .join('\n');
  return `<section aria-labelledby="corrections"><h2 id="corrections">Corrections and updates</h2><ul>\n${items}\n</ul></section>`;
}

function roundupPage(model: StandInModel, preview = false): string {
  const products = model.products.map((p) => `<li><a href="${p.path}">${escape(p.name)}</a></li>`).join('\n');
  return page(
    model.title,
    `${preview ? '<p role="note">Preview — not published.</p>\n' : ''}<h1>${escape(model.title)}</h1>
<p>Published <time datetime="${model.publishedAt}">${model.publishedAt.slice(0, 10)}</time> · ${escape(model.platform)}</p>
<ul>
${products}
</ul>
${notesList(model.corrections)}`,
  );
}

export const standInRenderer: PublicSiteRenderer<StandInModel> = {
  publicPrefixes: [readerBase, '/sitemap.xml', '/robots.txt'],

  async freeze(manager: EntityManager, roundupId: number, options): Promise<StandInModel> {
    const roundup = await manager.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId });
    const entries = await manager
      .getRepository(RoundupEntryEntity)
      .find({ where: { roundupId, kind: 'tested' }, order: { position: 'ASC', id: 'ASC' } });
    const products = entries.length
      ? await manager.getRepository(ProductEntity).findBy({ id: In(entries.map((e) => e.productId)) })
      : [];
    return {
      roundupId,
      path: options.path ?? `${readerBase}/roundups/${roundupId}-${slugify(roundup.title)}`,
      title: roundup.title,
      platform: roundup.platform,
      publishedAt: options.publishedAt.toISOString(),
      updatedAt: options.updatedAt.toISOString(),
      corrections: options.corrections,
      products: entries
        .map((entry) => products.find((p) => p.id === entry.productId))
        .filter((p): p is ProductEntity => p !== undefined)
        .map((p) => {
          const name = productDisplayName(p);
          return { productId: p.id, name, path: `${readerBase}/products/${p.id}-${slugify(name)}` };
        }),
    };
  },

  renderPages(models: StandInModel[]): RenderedPage[] {
    const pages: RenderedPage[] = [];
    const html = 'text/html; charset=utf-8';
    for (const model of models) {
      pages.push({
        path: model.path,
        variant: '',
        contentType: html,
        body: roundupPage(model),
        roundupId: model.roundupId,
      });
    }
    const byProduct = new Map<number, { name: string; path: string; roundups: StandInModel[] }>();
    for (const model of models) {
      for (const product of model.products) {
        const entry = byProduct.get(product.productId) ?? { ...product, roundups: [] };
        entry.roundups.push(model);
        byProduct.set(product.productId, entry);
      }
    }
    for (const product of byProduct.values()) {
      const list = product.roundups.map((r) => `<li><a href="${r.path}">${escape(r.title)}</a></li>`).join('\n');
      pages.push({
        path: product.path,
        variant: '',
        contentType: html,
        body: page(product.name, `<h1>${escape(product.name)}</h1>\n<ul>\n${list}\n</ul>`),
        roundupId: null,
      });
    }
    const list = models.map((m) => `<li><a href="${m.path}">${escape(m.title)}</a></li>`).join('\n');
    pages.push({
      path: readerBase,
      variant: '',
      contentType: html,
      body: page('Published roundups', `<h1>Published roundups</h1>\n<ol>\n${list}\n</ol>`),
      roundupId: null,
    });
    const updated =
      models
        .map((m) => m.updatedAt)
        .sort()
        .at(-1) ?? new Date(0).toISOString();
    const entries = models
      .map(
        (m) =>
          `<entry><id>tag:benchwire,roundup:${m.roundupId}</id><title>${escape(m.title)}</title><updated>${m.updatedAt}</updated><link href="${m.path}"/></entry>`,
      )
      .join('\n');
    pages.push({
      path: `${readerBase}/feed.atom`,
      variant: '',
      contentType: 'application/atom+xml; charset=utf-8',
      body: `<?xml version="1.0" encoding="utf-8"?>\n<feed xmlns="http://www.w3.org/2005/Atom"><id>tag:benchwire,roundups</id><title>Published roundups</title><updated>${updated}</updated>\n${entries}\n</feed>\n`,
      roundupId: null,
    });
    const urls = [readerBase, ...models.map((m) => m.path), ...[...byProduct.values()].map((p) => p.path)];
    pages.push({
      path: '/sitemap.xml',
      variant: '',
      contentType: 'application/xml; charset=utf-8',
      body: `<?xml version="1.0" encoding="utf-8"?>\n<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">\n${urls.map((u) => `<url><loc>${u}</loc></url>`).join('\n')}\n</urlset>\n`,
      roundupId: null,
    });
    pages.push({
      path: '/robots.txt',
      variant: '',
      contentType: 'text/plain; charset=utf-8',
      body: 'User-agent: *\nAllow: /read\nDisallow: /api/\nDisallow: /preview/\nSitemap: /sitemap.xml\n',
      roundupId: null,
    });
    return pages;
  },

  renderPreview(model: StandInModel): string {
    return roundupPage(model, true);
  },
};
