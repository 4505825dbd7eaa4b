/**
 * The reader site's URL map. The staff app owns `/` and its own pages (`/roundups`, `/catalog`, …, see
 * src/app/router.tsx) and the API owns `/api`; every reader page lives under `/read`, except the files crawlers look
 * for at the root (`/robots.txt`, `/sitemap.xml`).
 *
 * | path | what |
 * |---|---|
 * | /read | home: recent roundups |
 * | /read/roundups/:id-:slug | a roundup's results page |
 * | /read/roundups/:id-:slug/results.csv | open data: every run of record |
 * | /read/roundups/:id-:slug/analysis.json | open data: analysis parameters and rubric |
 * | /read/roundups/:id-:slug/raw/run-:runId.:ext | open data: a raw logger file, where the editor allows it |
 * | /read/roundups/:id-:slug/charts/:key.png | a chart image as approved when the roundup was published |
 * | /read/products/:id-:slug | a board's published results across roundups, with the estimate form |
 * | /read/compare?product=…&configuration=… | compare published boards under one load configuration |
 * | /read/photos/:photoId/:width.:format | a published photo's web size |
 * | /read/feed.atom | Atom feed of published roundups |
 * | /sitemap.xml, /robots.txt | for crawlers |
 *
 * The temperature unit is chosen with `?unit=F` (or `unit=C`), remembered in the `bw_unit` cookie.
 */
export const readerBase = '/read';

export function slugify(text: string): string {
  const slug = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/€/g, 'eur')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80)
    .replace(/-+$/g, '');
  return slug || 'item';
}

/** The id at the start of an `:id-:slug` path segment, or null when the segment does not start with one. */
export function idFromSlug(segment: string): number | null {
  const match = /^([1-9][0-9]{0,9})(?:-|$)/.exec(segment);
  if (!match) return null;
  const id = Number(match[1]);
  return id <= 4_294_967_295 ? id : null;
}

export const publicPaths = {
  home: () => readerBase,
  roundup: (id: number, title: string) => `${readerBase}/roundups/${id}-${slugify(title)}`,
  roundupCsv: (roundupPath: string) => `${roundupPath}/results.csv`,
  roundupAnalysisJson: (roundupPath: string) => `${roundupPath}/analysis.json`,
  chartImage: (roundupPath: string, key: string) => `${roundupPath}/charts/${key}.png`,
  rawLog: (roundupPath: string, runId: number, extension: string) => `${roundupPath}/raw/run-${runId}${extension}`,
  product: (id: number, name: string) => `${readerBase}/products/${id}-${slugify(name)}`,
  compare: () => `${readerBase}/compare`,
  photo: (photoId: number, width: number, format: string) => `${readerBase}/photos/${photoId}/${width}.${format}`,
  feed: () => `${readerBase}/feed.atom`,
  sitemap: () => '/sitemap.xml',
  robots: () => '/robots.txt',
};
