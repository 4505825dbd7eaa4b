import type { MatrixProgress } from '../../../shared/schemas/matrix';

export interface ProgressMeterProps {
  progress: MatrixProgress;
  /** Where the "n of m accepted" words go: nowhere (tables), under the bar (roundup header) or beside it (dashboard). */
  words?: 'none' | 'below' | 'beside';
}

/** Accepted cells as a share of the matrix: a thin bar with the number printed beside it. */
export function ProgressMeter({ progress, words = 'none' }: ProgressMeterProps) {
  const { percentAccepted, acceptedCount, cellCount } = progress;
  const counted = cellCount === 0 ? 'No cells yet' : `${acceptedCount} of ${cellCount} cells accepted`;
  const label = cellCount === 0 ? counted : `${counted} (${percentAccepted} %)`;
  const wordsClass = 'text-[0.8125rem] text-muted';
  return (
    <div className={words === 'beside' ? 'flex items-center gap-2' : 'min-w-28'}>
      <div className="flex items-center gap-2">
        <div
          role="meter"
          aria-label="Cells accepted"
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={percentAccepted}
          aria-valuetext={label}
          className="h-1.5 w-20 shrink-0 overflow-hidden rounded-full bg-wash ring-1 ring-rule"
        >
          <div className="h-full bg-teal" style={{ width: `${percentAccepted}%` }} />
        </div>
        <span className="numeric whitespace-nowrap">{cellCount === 0 ? '—' : `${percentAccepted}\u2009%`}</span>
      </div>
      {words === 'below' && <p className={`mt-0.5 ${wordsClass}`}>{label}</p>}
      {words === 'beside' && <span className={`whitespace-nowrap ${wordsClass}`}>{counted}</span>}
    </div>
  );
}
