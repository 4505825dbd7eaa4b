import { escapeHtml } from './html';
import { publicPaths } from './public-paths';
import type { PublishedRoundup } from './published-roundup';
import { absoluteUrl, type ReaderSite } from './render-layout';

const xml = escapeHtml;

/**
 * Atom feed of published roundups (RFC 4287 §4.1: the feed has one id, title and updated, an author and a self link;
 * each entry one id, title and updated, an alternate link and a summary). Entry ids are the results pages' canonical
 * URLs, which never change for a roundup.
 */
export function atomFeed(site: ReaderSite, models: readonly PublishedRoundup[], now = new Date()): string {
  const updated =
    models
      .map((m) => m.updatedAt)
      .sort()
      .at(-1) ?? now.toISOString();
  const self = absoluteUrl(site, publicPaths.feed());
  const entries = models.map((model) => {
    const url = absoluteUrl(site, model.path);
    const tested = model.products.filter((p) => p.kind === 'tested');
    const picks = model.picks
      .map((pick) => {
        const product = model.products.find((p) => p.entryId === pick.entryId);
        return product ? `${pick.label}: ${product.name}` : null;
      })
      .filter(Boolean);
    const summary =
      model.standfirst ??
      `${tested.length} ${model.platform} boards tested for power-delivery temperatures.${picks.length ? ` ${picks.join('; ')}.` : ''}`;
    return `  <entry>
    <id>${xml(url)}</id>
    <title>${xml(model.headline)}</title>
    <updated>${xml(model.updatedAt)}</updated>
    <published>${xml(model.publishedAt)}</published>
    <link rel="alternate" type="text/html" href="${xml(url)}"/>
    <summary>${xml(summary)}</summary>
  </entry>`;
  });
  return `<?xml version="1.0" encoding="utf-8"?>
<feed xmlns="http://www.w3.org/2005/Atom">
  <id>${xml(self)}</id>
  <title>${xml(site.outletName)}: roundups</title>
  <updated>${xml(updated)}</updated>
  <author><name>${xml(site.outletName)}</name></author>
  <link rel="self" type="application/atom+xml" href="${xml(self)}"/>
  <link rel="alternate" type="text/html" href="${xml(absoluteUrl(site, publicPaths.home()))}"/>
${entries.join('\n')}
</feed>
`;
}

/** sitemaps.org 0.9: absolute URLs with their last change as a W3C datetime. */
export function sitemapXml(site: ReaderSite, models: readonly PublishedRoundup[]): string {
  const urls = new Map<string, string | null>();
  urls.set(
    publicPaths.home(),
    models
      .map((m) => m.updatedAt)
      .sort()
      .at(-1) ?? null,
  );
  urls.set(publicPaths.compare(), null);
  for (const model of models) {
    urls.set(model.path, model.updatedAt);
    for (const product of model.products.filter((p) => p.kind === 'tested')) {
      const known = urls.get(product.path);
      if (!known || known < model.updatedAt) urls.set(product.path, model.updatedAt);
    }
  }
  const body = [...urls.entries()]
    .map(
      ([path, lastmod]) =>
        `  <url><loc>${xml(absoluteUrl(site, path))}</loc>${lastmod ? `<lastmod>${xml(lastmod)}</lastmod>` : ''}</url>`,
    )
    .join('\n');
  return `<?xml version="1.0" encoding="UTF-8"?>
<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">
${body}
</urlset>
`;
}

/** Crawlers may read the reader site; the staff app and the API are not for them. */
export function robotsTxt(site: ReaderSite): string {
  return `User-agent: *
Allow: /read
Allow: /sitemap.xml
Disallow: /api/
Disallow: /

Sitemap: ${absoluteUrl(site, publicPaths.sitemap())}
`;
}
