import { cx } from '../../lib/class-names';

export interface SpinnerProps {
  size?: 'sm' | 'md' | 'lg';
  /** Read out to screen readers; omit when the surrounding text already says what is happening. */
  label?: string;
  className?: string;
}

const sizes = { sm: 'size-3.5 border-2', md: 'size-5 border-2', lg: 'size-8 border-[3px]' };

export function Spinner({ size = 'md', label, className }: SpinnerProps) {
  return (
    <span
      role={label ? 'status' : undefined}
      aria-hidden={label ? undefined : true}
      className={cx('inline-block shrink-0', className)}
    >
      <span
        className={cx(
          'block animate-spin rounded-full border-current border-r-transparent motion-reduce:animate-[spin_3s_linear_infinite]',
          sizes[size],
        )}
      />
      {label && <span className="sr-only">{label}</span>}
    </span>
  );
}
