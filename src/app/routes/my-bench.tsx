import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { BenchCautions } from '../../features/bench-booking/components/bench-cautions';
import { MyBookings } from '../../features/bench-booking/components/my-bookings';
import { benchesQueryOptions, useBenches } from '../../features/benches/api/get-benches';
import { useTransitionCell } from '../../features/matrix/api/transition-cell';
import { myBenchQueryOptions, useMyBench } from '../../features/my-bench/api/get-my-bench';
import { MyBenchOverview } from '../../features/my-bench/components/my-bench-overview';
import { bookableStates } from '../../../shared/domain/planning/matrix-cell-states';
import { gatedPage, pageLoader, useOpenedAt } from '../page-route';

export const loader = pageLoader(paths.myBench, (queryClient) =>
  Promise.all([queryClient.ensureQueryData(myBenchQueryOptions()), queryClient.ensureQueryData(benchesQueryOptions())]),
);

const matrixPath = (roundupId: number) => `${paths.roundup(roundupId)}?tab=matrix`;

export const Component = gatedPage({ path: paths.myBench, pageName: 'My bench' }, MyBenchPage);

function MyBenchPage() {
  const openedAt = useOpenedAt();
  const myBench = useMyBench();
  const benches = useBenches();
  const transition = useTransitionCell();
  const bookable = myBench.queue.filter((item) => bookableStates.includes(item.cell.state));
  return (
    <>
      <PageHeader
        eyebrow="Bench"
        title="My bench"
        description="The matrix cells assigned to you, the bench time you have booked, and booking more."
      />
      <div className="space-y-6">
        <BenchCautions />
        <MyBenchOverview myBench={myBench} matrixPath={matrixPath} moveCell={transition.mutateAsync} />
        <MyBookings bookings={myBench.upcomingBookings} benches={benches} cells={bookable} openedAt={openedAt} />
      </div>
    </>
  );
}
