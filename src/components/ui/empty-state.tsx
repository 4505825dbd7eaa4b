import type { ReactNode } from 'react';

export interface EmptyStateProps {
  title: ReactNode;
  children?: ReactNode;
  /** The next step, usually a Button. */
  action?: ReactNode;
}

export function EmptyState({ title, children, action }: EmptyStateProps) {
  return (
    <div className="rounded-[3px] border border-dashed border-edge bg-surface/60 px-5 py-8 text-center">
      <p className="font-semibold text-ink">{title}</p>
      {children && <div className="mx-auto mt-1 max-w-prose text-sm text-muted">{children}</div>}
      {action && <div className="mt-4 flex justify-center">{action}</div>}
    </div>
  );
}
