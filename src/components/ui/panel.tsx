import { useId, type ReactNode } from 'react';
import { cx } from '../../lib/class-names';

export interface PanelProps {
  title: ReactNode;
  description?: ReactNode;
  /** Buttons in the panel's heading row. */
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
  /** An anchor other pages link to (the panel then stops a little below the top edge when scrolled to). */
  id?: string;
  /** Lays out the body, e.g. `space-y-3` or a grid. */
  bodyClassName?: string;
}

/** A titled section of a page (an h2 with its content), drawn as a sheet on the paper. */
export function Panel({ title, description, actions, children, className, id, bodyClassName }: PanelProps) {
  const headingId = useId();
  return (
    <section
      id={id}
      aria-labelledby={headingId}
      className={cx('min-w-0 rounded-[3px] border border-rule bg-surface', id && 'scroll-mt-4', className)}
    >
      <div className="flex flex-wrap items-start justify-between gap-3 border-b border-rule px-4 py-3">
        <div className="min-w-0">
          <h2 id={headingId} className="text-base font-semibold text-ink">
            {title}
          </h2>
          {description && <div className="mt-0.5 text-sm text-muted">{description}</div>}
        </div>
        {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
      </div>
      <div className={cx('px-4 py-4', bodyClassName)}>{children}</div>
    </section>
  );
}
