import { cx } from '../../lib/class-names';
import { cellStateLabels, type CellState } from '../../../shared/domain/planning/matrix-cell-states';

// Each state has its own mark and word as well as its colour, so the state reads without colour too.
const looks: Record<CellState, { box: string; glyph: string }> = {
  'not-started': { box: 'border-rule border-dashed text-muted', glyph: '○' },
  assigned: { box: 'border-edge text-ink', glyph: '◔' },
  running: { box: 'border-copper text-copper', glyph: '▶' },
  recorded: { box: 'border-amber text-ink bg-amber/10', glyph: '■' },
  'needs-retest': { box: 'border-red text-red bg-red/5', glyph: '↺' },
  accepted: { box: 'border-teal text-teal bg-teal/10', glyph: '✓' },
};

export function CellStateBadge({ state, className }: { state: CellState; className?: string }) {
  const look = looks[state];
  return (
    <span
      className={cx(
        'inline-flex items-center gap-1 rounded-[2px] border px-1.5 py-px text-xs leading-5 font-semibold whitespace-nowrap',
        look.box,
        className,
      )}
    >
      <span aria-hidden="true" className="font-mono">
        {look.glyph}
      </span>
      {cellStateLabels[state]}
    </span>
  );
}
