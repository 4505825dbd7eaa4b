import { cx } from '../../../lib/class-names';
import type { VerdictCode, VerdictStatus } from '../../../../shared/schemas/analysis';

// Colour is never alone: each verdict has its own glyph and its label, and a failed run is hatched as well.
const styles: Record<VerdictCode, { text: string; swatch: string; glyph: string; hatched: boolean }> = {
  comfortable: { text: 'text-teal', swatch: 'border-teal bg-teal', glyph: '○', hatched: false },
  warm: { text: 'text-amber', swatch: 'border-amber bg-amber', glyph: '◐', hatched: false },
  'hot-but-held': { text: 'text-copper', swatch: 'border-copper bg-copper', glyph: '●', hatched: false },
  throttled: { text: 'text-red', swatch: 'border-red', glyph: '✕', hatched: true },
};
/** No verdict yet: an empty dashed box in ink, never a verdict colour. */
const withheldStyle = { text: 'text-ink', swatch: 'border-muted border-dashed', glyph: '–', hatched: false };

export interface VerdictMarkProps {
  /** Null when the verdict is withheld. */
  code: VerdictCode | null;
  /** The verdict in words, its status included: "Hot but held", "Provisional: Warm", "No verdict yet". */
  label: string;
  status?: VerdictStatus;
  size?: 'md' | 'lg';
}

export function VerdictMark({ code, label, status = 'final', size = 'md' }: VerdictMarkProps) {
  const style = code === null || status === 'withheld' ? withheldStyle : styles[code];
  const provisional = status === 'provisional';
  return (
    <span
      className={cx('inline-flex items-center gap-2 font-semibold', style.text, size === 'lg' ? 'text-2xl' : 'text-sm')}
    >
      <span
        aria-hidden="true"
        className={cx(
          'inline-block shrink-0 rounded-[2px] border-2',
          // A provisional verdict shows its colour as an outline only: not yet a settled result.
          provisional ? style.swatch.replace(/\bbg-\S+/, 'border-dashed') : style.swatch,
          size === 'lg' ? 'size-6' : 'size-3.5',
        )}
        style={
          style.hatched
            ? { backgroundImage: 'repeating-linear-gradient(135deg, currentColor 0 2px, transparent 2px 6px)' }
            : undefined
        }
      />
      <span aria-hidden="true" className="font-mono">
        {style.glyph}
      </span>
      <span>{label}</span>
    </span>
  );
}
