import { Button, type ButtonVariant } from './button';

/** A form's submit button with what the last save did beside it, announced to screen readers. */
export function SubmitRow({
  label,
  pending,
  done,
  variant = 'primary',
}: {
  label: string;
  pending: boolean;
  /** What the last save did ("Saved."); nothing while there is nothing to say. */
  done?: string | null;
  variant?: ButtonVariant;
}) {
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button type="submit" variant={variant} pending={pending}>
        {label}
      </Button>
      {done && (
        <p role="status" className="text-sm text-teal">
          {done}
        </p>
      )}
    </div>
  );
}
