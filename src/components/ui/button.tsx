import type { ButtonHTMLAttributes, Ref } from 'react';
import { cx } from '../../lib/class-names';
import { Spinner } from './spinner';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'quiet';
export type ButtonSize = 'md' | 'sm';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-copper text-on-accent border-copper hover:bg-copper/90',
  secondary: 'bg-surface text-ink border-edge hover:bg-wash',
  danger: 'bg-surface text-red border-red hover:bg-red hover:text-on-accent',
  quiet: 'bg-transparent text-ink border-transparent hover:bg-wash underline-offset-2 hover:underline',
};

const sizes: Record<ButtonSize, string> = {
  md: 'min-h-9 px-3.5 text-sm',
  sm: 'min-h-8 px-2.5 text-[0.8125rem]',
};

/** The classes of a button, for links that must look like one. */
export function buttonStyles(variant: ButtonVariant = 'secondary', size: ButtonSize = 'md', className?: string) {
  return cx(
    'inline-flex items-center justify-center gap-2 rounded-[3px] border font-medium whitespace-nowrap',
    'transition-colors disabled:cursor-not-allowed disabled:opacity-55',
    variants[variant],
    sizes[size],
    className,
  );
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Shows a spinner, keeps the label and blocks a second press while a request runs. */
  pending?: boolean;
  ref?: Ref<HTMLButtonElement>;
}

export function Button({
  variant = 'secondary',
  size = 'md',
  pending = false,
  type = 'button',
  disabled,
  className,
  children,
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={buttonStyles(variant, size, className)}
      {...rest}
    >
      {pending && <Spinner size="sm" />}
      {children}
    </button>
  );
}
