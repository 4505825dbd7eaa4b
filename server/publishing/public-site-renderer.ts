import type { EntityManager } from 'typeorm';

/** A dated note readers see in the corrections log of a page. */
export interface PublishedNote {
  /** ISO 8601 instant. */
  at: string;
  kind: 'correction' | 'update';
  note: string;
}

/** What publishing needs to know of a frozen published roundup; the renderer's model carries more. */
export interface FrozenRoundup {
  roundupId: number;
  /** The roundup's public page. */
  path: string;
  /** ISO 8601 instants. */
  publishedAt: string;
  updatedAt: string;
  corrections: PublishedNote[];
}

export interface RenderedPage {
  path: string;
  /** '' for the page every reader gets; a named variant (e.g. 'unit=F') chosen from the request otherwise. */
  variant: string;
  contentType: string;
  body: string | Buffer;
  /** The roundup the page belongs to; null for pages over all roundups (home, feed, sitemap). */
  roundupId: number | null;
}

/**
 * How publishing freezes a roundup and renders its public URLs. Publishing stores what `freeze` returns as JSON and
 * renders every public page from the frozen models of all published roundups, so a later edit in the app reaches
 * readers only when an editor publishes an update. The reader site's renderers implement this; the stand-in in
 * stand-in-renderer.ts keeps publishing testable until they do.
 */
export interface PublicSiteRenderer<M extends FrozenRoundup = FrozenRoundup> {
  freeze(
    manager: EntityManager,
    roundupId: number,
    options: {
      publishedAt: Date;
      updatedAt: Date;
      corrections: PublishedNote[];
      /** The address readers already have (from the first publication), kept when an update changes the title. */
      path?: string;
    },
  ): Promise<M>;
  /** Every snapshot page for the published roundups (newest first): their pages and the pages over all of them. */
  renderPages(models: M[]): Promise<RenderedPage[]> | RenderedPage[];
  /** The roundup's page from live (unpublished) data, for a signed preview link. */
  renderPreview(model: M): Promise<string> | string;
  /** Paths under which nothing exists unless a snapshot is there: answered 404 before publication. */
  readonly publicPrefixes: readonly string[];
}
