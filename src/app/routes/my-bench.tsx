import type { QueryClient } from '@tanstack/react-query';
import { useLoaderData } from 'react-router';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { sessionQueryOptions } from '../../features/auth/api/get-session';
import { BenchCautions } from '../../features/bench-booking/components/bench-cautions';
import { MyBookings } from '../../features/bench-booking/components/my-bookings';
import { benchesQueryOptions, useBenches } from '../../features/benches/api/get-benches';
import { useTransitionCell } from '../../features/matrix/api/transition-cell';
import { myBenchQueryOptions, useMyBench } from '../../features/my-bench/api/get-my-bench';
import { MyBenchOverview } from '../../features/my-bench/components/my-bench-overview';
import { bookableStates } from '../../../shared/domain/planning/matrix-cell-states';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';

export function loader(queryClient: QueryClient) {
  return async () => {
    const openedAt = Date.now();
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (user && canOpen(paths.myBench, user.role)) {
      await Promise.all([
        queryClient.ensureQueryData(myBenchQueryOptions()),
        queryClient.ensureQueryData(benchesQueryOptions()),
      ]);
    }
    return { openedAt };
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
      <MyBenchPage />
    </RoleGate>
  );
}

function MyBenchPage() {
  const { openedAt } = useLoaderData() as { openedAt: number };
  const myBench = useMyBench();
  const benches = useBenches();
  const transition = useTransitionCell();
  const bookable = myBench.queue.filter((item) => bookableStates.includes(item.cell.state));
  return (
    <div className="space-y-6">
      <BenchCautions />
      <MyBenchOverview myBench={myBench} matrixPath={matrixPath} moveCell={transition.mutateAsync} />
      <MyBookings bookings={myBench.upcomingBookings} benches={benches} cells={bookable} openedAt={openedAt} />
    </div>
  );
}
