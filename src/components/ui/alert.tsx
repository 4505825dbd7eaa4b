import type { ReactNode } from 'react';
import { cx } from '../../lib/class-names';

export type AlertTone = 'info' | 'success' | 'warning' | 'danger' | 'caution';

export interface AlertProps {
  tone?: AlertTone;
  title?: ReactNode;
  children?: ReactNode;
  /**
   * Read out when it appears (role="alert" for danger, "status" otherwise). Leave off for static callouts such as
   * a safety note, which should not interrupt.
   */
  announce?: boolean;
  className?: string;
}

const tones: Record<AlertTone, { bar: string; mark: string; glyph: string; label: string }> = {
  info: { bar: 'border-l-slate', mark: 'text-slate', glyph: 'i', label: 'Note' },
  success: { bar: 'border-l-teal', mark: 'text-teal', glyph: '✓', label: 'Done' },
  warning: { bar: 'border-l-amber', mark: 'text-amber', glyph: '!', label: 'Warning' },
  danger: { bar: 'border-l-red', mark: 'text-red', glyph: '✕', label: 'Error' },
  caution: { bar: 'border-l-copper', mark: 'text-copper', glyph: '▲', label: 'Caution' },
};

/** A boxed message: an outcome, a problem, or a standing caution (bench safety). */
export function Alert({ tone = 'info', title, children, announce = false, className }: AlertProps) {
  const style = tones[tone];
  const role = announce ? (tone === 'danger' ? 'alert' : 'status') : undefined;
  return (
    <div
      role={role}
      className={cx(
        'flex gap-3 rounded-[3px] border border-l-4 border-rule bg-surface px-3.5 py-2.5',
        style.bar,
        className,
      )}
    >
      <span aria-hidden="true" className={cx('mt-px w-3 shrink-0 text-center font-mono text-sm font-bold', style.mark)}>
        {style.glyph}
      </span>
      <div className="min-w-0 text-sm">
        {title ? <p className="font-semibold text-ink">{title}</p> : <span className="sr-only">{style.label}: </span>}
        {children && <div className={cx('text-ink', title ? 'mt-0.5' : undefined)}>{children}</div>}
      </div>
    </div>
  );
}
