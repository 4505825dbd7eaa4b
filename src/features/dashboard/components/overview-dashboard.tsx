import { Panel } from '../../../components/ui/panel';
import type { Dashboard } from '../../../../shared/schemas/dashboard';
import { byTargetDate } from './dashboard-format';
import { RoundupProgressList } from './roundup-progress-list';
import { StateStrip } from './state-strip';

export interface OverviewDashboardProps {
  dashboard: Extract<Dashboard, { view: 'overview' }>;
  /** Left out for roles that cannot open roundups (admins). */
  roundupPath?: (id: number) => string;
}

/** Where the outlet's roundups stand: counts per state, and the ones still in progress. */
export function OverviewDashboard({ dashboard, roundupPath }: OverviewDashboardProps) {
  const inProgress = dashboard.roundupsByState
    .filter(({ state }) => state !== 'live' && state !== 'updated')
    .flatMap(({ roundups }) => roundups)
    .sort(byTargetDate);
  return (
    <div className="space-y-5">
      <StateStrip roundupsByState={dashboard.roundupsByState} />
      <Panel title="Roundups in progress" description="From Planning to Scheduled, soonest target first.">
        <RoundupProgressList roundups={inProgress} roundupPath={roundupPath} emptyTitle="No roundup is in progress" />
      </Panel>
    </div>
  );
}
