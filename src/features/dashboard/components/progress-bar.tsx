import type { MatrixProgress } from '../../../../shared/schemas/matrix';

/** Accepted cells as a share of the matrix, with the figures in words beside the bar. */
export function ProgressBar({ progress }: { progress: MatrixProgress }) {
  const { percentAccepted, acceptedCount, cellCount } = progress;
  const text = cellCount === 0 ? 'No cells yet' : `${acceptedCount} of ${cellCount} accepted`;
  return (
    <div className="flex items-center gap-2">
      <div
        role="meter"
        aria-label="Cells accepted"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percentAccepted}
        aria-valuetext={`${text} (${percentAccepted} %)`}
        className="h-1.5 w-24 shrink-0 overflow-hidden rounded-full bg-wash ring-1 ring-rule"
      >
        <div className="h-full bg-teal" style={{ width: `${percentAccepted}%` }} />
      </div>
      <span className="numeric whitespace-nowrap">{cellCount === 0 ? '—' : `${percentAccepted}\u2009%`}</span>
      <span className="text-[0.8125rem] whitespace-nowrap text-muted">{text}</span>
    </div>
  );
}
