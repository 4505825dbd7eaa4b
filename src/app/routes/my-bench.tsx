import type { QueryClient } from '@tanstack/react-query';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { sessionQueryOptions } from '../../features/auth/api/get-session';
import { benchesQueryOptions } from '../../features/my-bench/api/get-benches';
import { myBenchQueryOptions } from '../../features/my-bench/api/get-my-bench';
import { MyBenchOverview } from '../../features/my-bench/components/my-bench-overview';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';

export function loader(queryClient: QueryClient) {
  return async () => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (user && canOpen(paths.myBench, user.role)) {
      await Promise.all([
        queryClient.ensureQueryData(myBenchQueryOptions()),
        queryClient.ensureQueryData(benchesQueryOptions()),
      ]);
    }
    return null;
  };
}

const matrixPath = (roundupId: number) => `${paths.roundup(roundupId)}?tab=matrix`;

export function Component() {
  return (
    <RoleGate path={paths.myBench} pageName="My bench">
      <PageHeader
        eyebrow="Bench"
        title="My bench"
        description="The matrix cells assigned to you, the bench time you have booked, and booking more."
      />
      <MyBenchOverview matrixPath={matrixPath} />
    </RoleGate>
  );
}
