import { Link } from 'react-router';
import { buttonStyles } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { roundupsQueryOptions, useRoundups } from '../../features/roundups/api/get-roundups';
import { RoundupsTable } from '../../features/roundups/components/roundups-table';
import { may, planEditors } from '../../../shared/access/roles';

import { gatedPage, pageLoader } from '../page-route';
import type { CurrentUser } from '../../../shared/schemas/auth';
export const loader = pageLoader(paths.roundups, (queryClient) => queryClient.ensureQueryData(roundupsQueryOptions()));

export const Component = gatedPage({ path: paths.roundups, pageName: 'Roundups' }, RoundupsPage);

function RoundupsPage({ user }: { user: CurrentUser }) {
  const roundups = useRoundups();
  const newRoundup = may(user.role, planEditors) ? (
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
