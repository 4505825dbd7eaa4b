import type { ReactNode } from 'react';

export interface PageHeaderProps {
  /** The page's h1; also becomes the document title ("Users · Benchwire"). */
  title: string;
  description?: ReactNode;
  /** Buttons on the right (below the title on phones). */
  actions?: ReactNode;
  /** A small label above the title, e.g. the area of the product. */
  eyebrow?: ReactNode;
  /** The document title when it should differ from the h1 (e.g. "Dashboard" for a greeting). */
  documentTitle?: string;
}

export function PageHeader({ title, description, actions, eyebrow, documentTitle }: PageHeaderProps) {
  return (
    <header className="mb-6 flex flex-col gap-3 border-b border-rule pb-4 sm:flex-row sm:items-end sm:justify-between">
      <title>{`${documentTitle ?? title} · Benchwire`}</title>
      <div className="min-w-0">
        {eyebrow && <p className="mb-1 font-mono text-xs tracking-wide text-muted uppercase">{eyebrow}</p>}
        <h1 className="text-2xl leading-tight font-semibold tracking-tight text-ink">{title}</h1>
        {description && <div className="mt-1 max-w-[70ch] text-sm text-muted">{description}</div>}
      </div>
      {actions && <div className="flex shrink-0 flex-wrap gap-2">{actions}</div>}
    </header>
  );
}
