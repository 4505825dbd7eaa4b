import type { MatrixProgress } from '../../../../shared/schemas/matrix';

export interface ProgressMeterProps {
  progress: MatrixProgress;
  /** Show the "n of m accepted" line under the bar. */
  detailed?: boolean;
}

/** Accepted cells as a share of the matrix: a thin bar with the number printed beside it. */
export function ProgressMeter({ progress, detailed = false }: ProgressMeterProps) {
  const { percentAccepted, acceptedCount, cellCount } = progress;
  const label =
    cellCount === 0 ? 'No cells yet' : `${acceptedCount} of ${cellCount} cells accepted (${percentAccepted} %)`;
  return (
    <div className="min-w-28">
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
      {detailed && <p className="mt-0.5 text-[0.8125rem] text-muted">{label}</p>}
    </div>
  );
}
