import type { DisplayUnit } from '../../shared/domain/reader/temperature-display';
import { html, jsonForScript, type SafeHtml } from './html';
import { publicPaths } from './public-paths';

/** What every reader page needs to know about the site it is rendered for. */
export interface ReaderSite {
  /** Absolute origin for canonical URLs, feeds and previews, without a trailing slash (https://example.org). */
  baseUrl: string;
  outletName: string;
  /** Built files from the client build's manifest; null where no client was built (API tests). */
  assets: { stylesheet: string | null; script: string | null };
}

export interface PageMeta {
  title: string;
  description: string;
  /** Site-relative path of the canonical URL (no unit query). */
  path: string;
  ogType: 'website' | 'article';
  ogImage?: { url: string; width: number; height: number; alt: string } | null;
  jsonLd?: unknown;
  /** The current query without `unit`, kept by the unit switch links (compare selections, estimate inputs). */
  query?: URLSearchParams;
}

export function absoluteUrl(site: ReaderSite, path: string): string {
  return /^https?:\/\//.test(path) ? path : `${site.baseUrl}${path.startsWith('/') ? '' : '/'}${path}`;
}

function unitLink(meta: PageMeta, unit: DisplayUnit): string {
  const query = new URLSearchParams(meta.query);
  query.delete('unit');
  query.set('unit', unit);
  return `${meta.path}?${query.toString()}`;
}

/** The °C/°F switch: plain links that work without JavaScript; the reader script switches in place when it runs. */
function unitSwitch(meta: PageMeta, unit: DisplayUnit): SafeHtml {
  const option = (value: DisplayUnit, label: string) =>
    html`<a
      href="${unitLink(meta, value)}"
      class="unit-option"
      data-unit="${value}"
      ${value === unit ? html`aria-current="true"` : ''}
      ><span class="visually-hidden">Show temperatures in </span>${label}</a
    >`;
  return html`<nav class="unit-switch" aria-label="Temperature unit">${option('C', '°C')}${option('F', '°F')}</nav>`;
}

/** The page shell: head with canonical, Open Graph and JSON-LD, banner, main landmark, footer. */
export function renderPage(site: ReaderSite, meta: PageMeta, unit: DisplayUnit, body: SafeHtml): string {
  const canonical = absoluteUrl(site, meta.path);
  const image = meta.ogImage ?? null;
  return `<!DOCTYPE html>\n${html`<html lang="en-GB" data-unit="${unit}">
    <head>
      <meta charset="utf-8" />
      <meta name="viewport" content="width=device-width, initial-scale=1" />
      <title>${meta.title} · ${site.outletName}</title>
      <meta name="description" content="${meta.description}" />
      <link rel="canonical" href="${canonical}" />
      <link
        rel="alternate"
        type="application/atom+xml"
        title="${site.outletName}: roundups"
        href="${absoluteUrl(site, publicPaths.feed())}"
      />
      <meta property="og:site_name" content="${site.outletName}" />
      <meta property="og:title" content="${meta.title}" />
      <meta property="og:description" content="${meta.description}" />
      <meta property="og:type" content="${meta.ogType}" />
      <meta property="og:url" content="${canonical}" />
      ${
        image
          ? html`<meta property="og:image" content="${absoluteUrl(site, image.url)}" />
              <meta property="og:image:width" content="${image.width}" />
              <meta property="og:image:height" content="${image.height}" />
              <meta property="og:image:alt" content="${image.alt}" />`
          : ''
      }
      ${site.assets.stylesheet ? html`<link rel="stylesheet" href="${site.assets.stylesheet}" />` : ''}
      ${site.assets.script ? html`<script type="module" src="${site.assets.script}"></script>` : ''}
      ${
        meta.jsonLd
          ? html`<script type="application/ld+json">
              ${jsonForScript(meta.jsonLd)}
            </script>`
          : ''
      }
    </head>
    <body class="reader">
      <a class="skip-link" href="#main">Skip to the content</a>
      <header class="site-header">
        <div class="site-header-inner">
          <a class="site-name" href="${publicPaths.home()}">${site.outletName}</a>
          <nav class="site-nav" aria-label="Site">
            <ul>
              <li><a href="${publicPaths.home()}">Roundups</a></li>
              <li><a href="${publicPaths.compare()}">Compare boards</a></li>
              <li><a href="${publicPaths.feed()}">Feed</a></li>
            </ul>
          </nav>
          ${unitSwitch(meta, unit)}
        </div>
      </header>
      <main id="main" tabindex="-1">${body}</main>
      <footer class="site-footer">
        <p>
          ${site.outletName} tests boards in its own lab and buys or borrows every sample; each results page says which.
        </p>
        <p>Results pages are published with their measurements as open data.</p>
      </footer>
    </body>
  </html>`.toString()}\n`;
}
