import type { ReactNode } from 'react';
import { cx } from '../../lib/class-names';

export type BadgeTone = 'neutral' | 'accent' | 'positive' | 'caution' | 'negative' | 'muted';

export interface BadgeProps {
  tone?: BadgeTone;
  children: ReactNode;
  className?: string;
}

// Text stays in ink or a token with ≥ 4.5:1; the colour is also carried by the mark, never by colour alone.
const tones: Record<BadgeTone, { box: string; dot: string }> = {
  neutral: { box: 'border-edge text-ink', dot: 'bg-ink' },
  accent: { box: 'border-copper text-copper', dot: 'bg-copper' },
  positive: { box: 'border-teal text-teal', dot: 'bg-teal' },
  caution: { box: 'border-amber text-ink', dot: 'bg-amber' },
  negative: { box: 'border-red text-red', dot: 'bg-red' },
  muted: { box: 'border-rule text-muted border-dashed', dot: 'bg-transparent border border-muted' },
};

/** A short status word: a role, an account state, later a roundup state or a verdict. */
export function Badge({ tone = 'neutral', children, className }: BadgeProps) {
  const style = tones[tone];
  return (
    <span
      className={cx(
        'inline-flex items-center gap-1.5 rounded-[2px] border px-1.5 py-px text-xs leading-5 font-medium whitespace-nowrap',
        style.box,
        className,
      )}
    >
      <span aria-hidden="true" className={cx('size-1.5 rounded-full', style.dot)} />
      {children}
    </span>
  );
}
