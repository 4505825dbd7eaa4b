import { useEffect, useId, useRef, type ReactNode } from 'react';
import { cx } from '../../lib/class-names';

export interface DialogProps {
  open: boolean;
  /** Called for Escape and the close button; the parent sets `open` to false. */
  onClose: () => void;
  title: ReactNode;
  description?: ReactNode;
  children: ReactNode;
  /** Buttons along the bottom edge, e.g. Cancel and Save. */
  footer?: ReactNode;
  size?: 'sm' | 'md' | 'lg';
  className?: string;
}

const widths = { sm: 'max-w-md', md: 'max-w-xl', lg: 'max-w-3xl' };

/**
 * A modal on the native <dialog>: the browser traps focus, makes the page behind it inert and returns focus
 * to the opener. The content stays mounted while closed, so nothing typed is lost by closing it by mistake.
 */
export function Dialog({ open, onClose, title, description, children, footer, size = 'md', className }: DialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const descriptionId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      dialog.showModal();
      // Start where the work is: a marked element, else the first field, else the browser's choice (the close button).
      const own = (selector: string) =>
        [...dialog.querySelectorAll<HTMLElement>(selector)].find((element) => element.closest('dialog') === dialog);
      const preferred =
        own('[data-autofocus]') ?? own('[data-dialog-body] :is(input, select, textarea):not([disabled])');
      preferred?.focus();
    }
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
      onCancel={(event) => {
        // React passes a nested dialog's cancel up the component tree; only this dialog's own Escape closes it.
        if (event.target !== event.currentTarget) return;
        event.preventDefault();
        onClose();
      }}
      className={cx(
        'm-auto w-[calc(100%-1.5rem)] max-h-[calc(100dvh-1.5rem)] overflow-hidden rounded-[4px] border border-edge',
        'bg-surface p-0 text-ink shadow-[0_18px_50px_-12px_rgb(16_22_31/0.45)] backdrop:backdrop-blur-[1px]',
        'open:flex open:flex-col',
        widths[size],
        className,
      )}
    >
      <header className="flex items-start justify-between gap-4 border-b border-rule px-5 pt-4 pb-3">
        <div>
          <h2 id={titleId} className="text-lg leading-snug font-semibold">
            {title}
          </h2>
          {description && (
            <p id={descriptionId} className="mt-0.5 text-sm text-muted">
              {description}
            </p>
          )}
        </div>
        <button
          type="button"
          onClick={onClose}
          aria-label="Close"
          className="-mr-1.5 grid size-8 shrink-0 place-items-center rounded-[3px] text-xl leading-none text-muted hover:bg-wash hover:text-ink"
        >
          <span aria-hidden="true">×</span>
        </button>
      </header>
      <div data-dialog-body className="min-h-0 flex-1 overflow-y-auto px-5 py-4">
        {children}
      </div>
      {footer && (
        <footer className="flex flex-wrap justify-end gap-2 border-t border-rule bg-paper/60 px-5 py-3">
          {footer}
        </footer>
      )}
    </dialog>
  );
}
