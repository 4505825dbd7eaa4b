import type { QueryClient } from '@tanstack/react-query';
import { useSession } from '../../features/auth/api/get-session';
import { dashboardQueryOptions, useDashboard } from '../../features/dashboard/api/get-dashboard';
import { EditorDashboard } from '../../features/dashboard/components/editor-dashboard';
import { OverviewDashboard } from '../../features/dashboard/components/overview-dashboard';
import { RoleWelcome } from '../../features/dashboard/components/role-welcome';
import { TesterDashboard } from '../../features/dashboard/components/tester-dashboard';
import { paths } from '../../lib/paths';
import type { Dashboard } from '../../../shared/schemas/dashboard';
import { canOpen, navigationFor } from '../navigation';
import { useDevInboxAvailable } from '../../features/mail/api/get-dev-inbox';
import { may, placeAccess } from '../../../shared/access/roles';

export function loader(queryClient: QueryClient) {
  return async () => {
    await queryClient.ensureQueryData(dashboardQueryOptions());
    return null;
  };
}

const roundupPath = (id: number, tab?: string) => (tab ? `${paths.roundup(id)}?tab=${tab}` : paths.roundup(id));

export function Component() {
  const user = useSession();
  const dashboard = useDashboard();
  const devInbox = useDevInboxAvailable(Boolean(user && may(user.role, placeAccess.devInbox)));
  if (!user) return null;
  const places = navigationFor(user.role).filter(
    (entry) => entry.to !== paths.dashboard && (devInbox || entry.to !== paths.devInbox),
  );
  return (
    <RoleWelcome user={user} places={places}>
      <RoleWork dashboard={dashboard} canOpenRoundups={canOpen(paths.roundups, user.role)} />
    </RoleWelcome>
  );
}

function RoleWork({ dashboard, canOpenRoundups }: { dashboard: Dashboard; canOpenRoundups: boolean }) {
  switch (dashboard.view) {
    case 'editor':
      return <EditorDashboard dashboard={dashboard} roundupPath={roundupPath} />;
    case 'tester':
      return <TesterDashboard dashboard={dashboard} myBenchPath={paths.myBench} />;
    case 'overview':
      return <OverviewDashboard dashboard={dashboard} roundupPath={canOpenRoundups ? roundupPath : undefined} />;
  }
}
