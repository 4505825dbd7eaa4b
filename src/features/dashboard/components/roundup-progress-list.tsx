import { Link } from 'react-router';
import { EmptyState } from '../../../components/ui/empty-state';
import type { RoundupSummary } from '../../../../shared/schemas/roundups';
import { formatCalendarDate } from '../../../lib/format-time';
import { ProgressMeter } from '../../../components/ui/progress-meter';
import { RoundupStateBadge } from '../../../components/ui/roundup-state-badge';

export interface RoundupProgressListProps {
  roundups: readonly RoundupSummary[];
  /** Link to a roundup; left out for roles that cannot open roundups. */
  roundupPath?: (id: number, tab?: string) => string;
  emptyTitle: string;
}

/** Roundups with their state, target date and matrix progress. */
export function RoundupProgressList({ roundups, roundupPath, emptyTitle }: RoundupProgressListProps) {
  if (roundups.length === 0) return <EmptyState title={emptyTitle} />;
  return (
    <ul className="divide-y divide-rule">
      {roundups.map((roundup) => (
        <li key={roundup.id} className="py-2.5 first:pt-0 last:pb-0">
          <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
            {roundupPath ? (
              <Link
                to={roundupPath(roundup.id)}
                className="font-semibold text-copper underline-offset-2 hover:underline"
              >
                {roundup.title}
              </Link>
            ) : (
              <span className="font-semibold">{roundup.title}</span>
            )}
            <RoundupStateBadge state={roundup.state} />
          </div>
          <p className="mt-0.5 text-[0.8125rem] text-muted">
            {roundup.platform} · {roundup.testedEntryCount} product{roundup.testedEntryCount === 1 ? '' : 's'} · target{' '}
            {roundup.targetPublishDate ? formatCalendarDate(roundup.targetPublishDate) : 'not set'}
            {roundup.overdueSampleCount > 0 && (
              <span className="font-semibold text-red"> · {roundup.overdueSampleCount} loan overdue</span>
            )}
          </p>
          <div className="mt-1">
            <ProgressMeter progress={roundup.progress} words="beside" />
          </div>
        </li>
      ))}
    </ul>
  );
}
