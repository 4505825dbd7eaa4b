import { useEffect, useState, type ReactNode } from 'react';
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
  /**
   * Shown open the first time on a page in a session, folded to its title after that (one click opens it again); never
   * removed. On by default for a caution with a title — the standing safety notes, which otherwise fill most of a
   * phone's first screen on every visit.
   */
  foldAfterRead?: boolean;
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
export function Alert({
  tone = 'info',
  title,
  children,
  announce = false,
  foldAfterRead = tone === 'caution' && typeof title === 'string',
  className,
}: AlertProps) {
  const style = tones[tone];
  if (foldAfterRead && typeof title === 'string' && children) {
    return (
      <FoldingAlert title={title} style={style} className={className}>
        {children}
      </FoldingAlert>
    );
  }
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

/** An outcome or failure that has just happened, read out as it appears; shows nothing while there is no message. */
export function AnnouncedAlert({
  tone,
  message,
  title,
  className,
}: {
  tone: AlertTone;
  message: ReactNode;
  title?: ReactNode;
  className?: string;
}) {
  if (!message) return null;
  return (
    <Alert tone={tone} title={title} announce className={className}>
      {message}
    </Alert>
  );
}

/** Points to read one by one (warnings, what still blocks a step) under the alert's title. */
export function ListAlert({
  items,
  listClassName = 'list-disc pl-4',
  ...alert
}: Omit<AlertProps, 'children'> & { items: readonly string[]; listClassName?: string }) {
  return (
    <Alert {...alert}>
      <ul className={listClassName}>
        {items.map((item) => (
          <li key={item}>{item}</li>
        ))}
      </ul>
    </Alert>
  );
}

// Remembered per page and title: a caution met on one page is still shown open the first time on another.
const readKey = (title: string) => `benchwire:read:${window.location.pathname}:${title}`;

function readThisSession(title: string): boolean {
  try {
    return window.sessionStorage.getItem(readKey(title)) === '1';
  } catch {
    return false;
  }
}

/** A standing note that opens the first time it is met in a session and is folded to its title afterwards. */
function FoldingAlert({
  title,
  style,
  className,
  children,
}: {
  title: string;
  style: (typeof tones)[AlertTone];
  className?: string;
  children: ReactNode;
}) {
  const [open, setOpen] = useState(() => !readThisSession(title));

  useEffect(() => {
    try {
      // Shown once: later pages in this session show it folded.
      window.sessionStorage.setItem(readKey(title), '1');
    } catch {
      // Without session storage it simply stays open.
    }
  }, [title]);

  return (
    <details
      open={open}
      onToggle={(event) => setOpen(event.currentTarget.open)}
      className={cx('group rounded-[3px] border border-l-4 border-rule bg-surface px-3.5 py-2.5', style.bar, className)}
    >
      <summary className="flex cursor-pointer list-none gap-3 text-sm [&::-webkit-details-marker]:hidden">
        <span aria-hidden="true" className={cx('mt-px w-3 shrink-0 text-center font-mono font-bold', style.mark)}>
          {style.glyph}
        </span>
        <span className="font-semibold text-ink">{title}</span>
        <span className="ml-auto text-[0.8125rem] whitespace-nowrap text-muted underline underline-offset-2">
          {open ? 'Fold' : 'Read again'}
        </span>
      </summary>
      <div className="mt-0.5 pl-6 text-sm text-ink">{children}</div>
    </details>
  );
}
