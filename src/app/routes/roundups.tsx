import type { QueryClient } from '@tanstack/react-query';
import { Link } from 'react-router';
import { buttonStyles } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { roundupsQueryOptions, useRoundups } from '../../features/roundups/api/get-roundups';
import { RoundupsTable } from '../../features/roundups/components/roundups-table';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import { may, planEditors } from '../../../shared/access/roles';

export function loader(queryClient: QueryClient) {
  return async () => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (user && canOpen(paths.roundups, user.role)) await queryClient.ensureQueryData(roundupsQueryOptions());
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.roundups} pageName="Roundups">
      <RoundupsPage />
    </RoleGate>
  );
}

function RoundupsPage() {
  const user = useSession();
  const roundups = useRoundups();
  const newRoundup =
    user && may(user.role, planEditors) ? (
      <Link to={paths.newRoundup} className={buttonStyles('primary')}>
        New roundup
      </Link>
    ) : null;
  return (
    <>
      <PageHeader
        eyebrow="Planning"
        title="Roundups"
        description="Each roundup compares boards of one platform in one price band, tested on one bench profile. It moves from Planning through On the bench, Writing, In review and Scheduled to Live."
        actions={newRoundup}
      />
      <RoundupsTable roundups={roundups} roundupPath={paths.roundup} emptyAction={newRoundup} />
    </>
  );
}
