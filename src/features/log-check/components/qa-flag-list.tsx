import { cx } from '../../../lib/class-names';
import type { QaFlag } from '../../../../shared/schemas/analysis';
import { formatDuration } from './format-figures';

const severityStyles: Record<QaFlag['severity'], { glyph: string; word: string; mark: string; bar: string }> = {
  warning: { glyph: '!', word: 'Warning', mark: 'border-amber text-amber', bar: 'border-l-amber' },
  info: { glyph: 'i', word: 'Note', mark: 'border-slate text-slate', bar: 'border-l-slate' },
};

/** The QA flags of a run, each with an icon, a word for its severity, its label in words and its message. */
export function QaFlagList({ flags }: { flags: readonly QaFlag[] }) {
  if (flags.length === 0) {
    return (
      <p className="flex items-center gap-2 text-sm text-ink">
        <span aria-hidden="true" className="font-mono font-bold text-teal">
          ✓
        </span>
        No QA flags: the room, the soak and the probes all look in order.
      </p>
    );
  }
  return (
    <ul className="space-y-2">
      {flags.map((flag, index) => {
        const style = severityStyles[flag.severity];
        return (
          <li
            key={`${flag.code}-${index}`}
            className={cx('flex gap-3 rounded-[3px] border border-l-4 border-rule bg-surface px-3 py-2', style.bar)}
          >
            <span
              aria-hidden="true"
              className={cx(
                'mt-0.5 flex size-5 shrink-0 items-center justify-center rounded-full border-2 font-mono text-xs font-bold',
                style.mark,
              )}
            >
              {style.glyph}
            </span>
            <div className="min-w-0 text-sm">
              <p className="text-ink">
                <span className="font-semibold">
                  {style.word} · {flag.label}:
                </span>{' '}
                {flag.message}
              </p>
              {(flag.channel || flag.atS !== null) && (
                <p className="mt-0.5 text-xs text-muted">
                  {flag.channel && <span className="font-mono">{flag.channel}</span>}
                  {flag.channel && flag.atS !== null && ' · '}
                  {flag.atS !== null && <>at {formatDuration(flag.atS)}</>}
                </p>
              )}
            </div>
          </li>
        );
      })}
    </ul>
  );
}
