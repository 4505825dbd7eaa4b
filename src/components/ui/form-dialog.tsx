import { useId, type FormEvent, type ReactNode } from 'react';
import type { FormErrorItem } from '../../lib/form-errors';
import { Button } from './button';
import { Dialog, type DialogProps } from './dialog';
import { FormErrorSummary } from './form-error-summary';

export interface FormDialogProps extends Pick<DialogProps, 'open' | 'onClose' | 'title' | 'description' | 'size'> {
  /** The submit button's words ("Save profile"). */
  submitLabel: string;
  submitVariant?: 'primary' | 'danger';
  pending?: boolean;
  /** Called on submit; the browser's own submit and validation are held back. */
  onSubmit: () => void;
  /** What stops the form (from useZodForm): shown at the top, each entry a link to its field. */
  problems?: { title: string; items: readonly FormErrorItem[]; message?: string; attempt: number };
  /** Spacing between the fields. */
  className?: string;
  children: ReactNode;
}

/** The props of a dialog that creates one record and hands it back to the page that opened it. */
export interface CreateDialogProps<Created> {
  open: boolean;
  onClose: () => void;
  onCreated: (created: Created) => void;
}

/**
 * A form in a dialog: Cancel and the submit button along the bottom, the error summary at the top. A dialog's form
 * may sit inside a page's form (a new bench profile within the New roundup form), so its submit stays its own.
 */
export function FormDialog({
  submitLabel,
  submitVariant = 'primary',
  pending,
  onSubmit,
  problems,
  className = 'space-y-4',
  children,
  ...dialog
}: FormDialogProps) {
  const formId = useId();
  const submit = (event: FormEvent) => {
    event.preventDefault();
    event.stopPropagation();
    onSubmit();
  };
  return (
    <Dialog
      {...dialog}
      footer={
        <>
          <Button onClick={dialog.onClose}>Cancel</Button>
          <Button type="submit" form={formId} variant={submitVariant} pending={pending}>
            {submitLabel}
          </Button>
        </>
      }
    >
      <form id={formId} noValidate onSubmit={submit} className={className}>
        {problems && (
          <FormErrorSummary
            title={problems.title}
            items={problems.items}
            message={problems.message}
            attempt={problems.attempt}
          />
        )}
        {children}
      </form>
    </Dialog>
  );
}
