import { Link } from 'react-router';
import { Badge } from '../../../components/ui/badge';
import { EmptyState } from '../../../components/ui/empty-state';
import { Panel } from '../../../components/ui/panel';
import type { Dashboard } from '../../../../shared/schemas/dashboard';
import { formatCalendarDate } from '../../../lib/format-time';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { byTargetDate } from './dashboard-format';
import { RoundupProgressList } from './roundup-progress-list';
import { StateStrip } from './state-strip';

export interface EditorDashboardProps {
  dashboard: Extract<Dashboard, { view: 'editor' }>;
  roundupPath: (id: number, tab?: string) => string;
}

/** What an editor steers: where each roundup stands, cells nobody has yet, loans that should be back. */
export function EditorDashboard({ dashboard, roundupPath }: EditorDashboardProps) {
  const open = dashboard.roundupsByState
    .filter(({ state }) => state === 'planning' || state === 'on-the-bench')
    .flatMap(({ roundups }) => roundups)
    .sort(byTargetDate);
  return (
    <div className="space-y-5">
      <StateStrip roundupsByState={dashboard.roundupsByState} />
      <div className="grid grid-cols-1 items-start gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <Panel title="Matrix progress" description="Roundups in Planning or On the bench, soonest target first.">
          <RoundupProgressList
            roundups={open}
            roundupPath={(id) => roundupPath(id, 'matrix')}
            emptyTitle="No roundup is being planned or tested"
          />
        </Panel>
        <div className="space-y-5">
          <Panel title="Unassigned cells">
            {dashboard.unassignedCells.length === 0 ? (
              <p className="text-sm text-muted">Every cell of the open roundups has a tester.</p>
            ) : (
              <ul className="divide-y divide-rule text-sm">
                {dashboard.unassignedCells.map((item) => (
                  <li
                    key={item.roundupId}
                    className="flex items-baseline justify-between gap-3 py-2 first:pt-0 last:pb-0"
                  >
                    <Link
                      to={roundupPath(item.roundupId, 'matrix')}
                      className="text-copper underline-offset-2 hover:underline"
                    >
                      {item.title}
                    </Link>
                    <span className="numeric whitespace-nowrap">
                      {item.unassignedCount} cell{item.unassignedCount === 1 ? '' : 's'}
                    </span>
                  </li>
                ))}
              </ul>
            )}
          </Panel>
          <Panel title="Overdue loans" description="Vendor loans past their return-by date, longest overdue first.">
            {dashboard.overdueSamples.length === 0 ? (
              <EmptyState title="No loan is overdue" />
            ) : (
              <ul className="divide-y divide-rule text-sm">
                {dashboard.overdueSamples.map((sample) => (
                  <li key={sample.id} className="py-2 first:pt-0 last:pb-0">
                    <div className="flex flex-wrap items-center justify-between gap-2">
                      <span className="font-semibold">{productDisplayName(sample.product)}</span>
                      <Badge tone="negative">
                        Overdue by {sample.daysOverdue} day{sample.daysOverdue === 1 ? '' : 's'}
                      </Badge>
                    </div>
                    <p className="text-[0.8125rem] text-muted">
                      Due back {sample.returnBy ? formatCalendarDate(sample.returnBy) : '—'}
                      {sample.vendorContact && ` to ${sample.vendorContact}`} ·{' '}
                      <Link
                        to={roundupPath(sample.roundupId, 'samples')}
                        className="text-copper underline underline-offset-2"
                      >
                        {sample.roundupTitle}
                      </Link>
                    </p>
                  </li>
                ))}
              </ul>
            )}
          </Panel>
        </div>
      </div>
    </div>
  );
}
