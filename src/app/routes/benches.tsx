import { useSearchParams } from 'react-router';
import { paths } from '../../lib/paths';
import { bookingsQueryOptions, useBookings } from '../../features/bench-booking/api/get-bookings';
import { BenchCautions } from '../../features/bench-booking/components/bench-cautions';
import { BookingCalendar } from '../../features/bench-booking/components/booking-calendar';
import { weekFromParams } from '../../features/bench-booking/components/booking-time';
import { benchesQueryOptions } from '../../features/benches/api/get-benches';
import { BenchesOverview } from '../../features/benches/components/benches-overview';
import { myBenchQueryOptions, useMyBench } from '../../features/my-bench/api/get-my-bench';
import { benchProfilesQueryOptions, useBenchProfiles } from '../../features/roundups/api/bench-profiles';
import { bookableStates } from '../../../shared/domain/planning/matrix-cell-states';
import type { Role } from '../../../shared/schemas/common';
import type { CurrentUser } from '../../../shared/schemas/auth';
import { gatedPage, pageLoader, useOpenedAt } from '../page-route';
import { bookers, may, planEditors } from '../../../shared/access/roles';

const canManageBenches = (role: Role) => may(role, planEditors);
const canBook = (role: Role) => may(role, bookers);

export const loader = pageLoader(paths.benches, (queryClient, { request }, user, openedAt) => {
  const { from, to } = weekFromParams(new URL(request.url).searchParams, openedAt);
  return Promise.all([
    queryClient.ensureQueryData(benchesQueryOptions()),
    queryClient.ensureQueryData(bookingsQueryOptions({ from, to })),
    canBook(user.role) ? queryClient.ensureQueryData(myBenchQueryOptions()) : null,
    canManageBenches(user.role) ? queryClient.ensureQueryData(benchProfilesQueryOptions()) : null,
  ]);
});

export const Component = gatedPage({ path: paths.benches, pageName: 'Benches' }, BenchesPage);

function BenchesPage({ user }: { user: CurrentUser }) {
  if (canBook(user.role)) return <TesterBenches userId={user.id} />;
  if (canManageBenches(user.role)) return <EditorBenches userId={user.id} />;
  return <Benches userId={user.id} canManage={false} profiles={[]} bookableCells={null} />;
}

function TesterBenches({ userId }: { userId: number }) {
  const { queue } = useMyBench();
  const cells = queue.filter((item) => bookableStates.includes(item.cell.state));
  return <Benches userId={userId} canManage={false} profiles={[]} bookableCells={cells} />;
}

function EditorBenches({ userId }: { userId: number }) {
  const profiles = useBenchProfiles();
  return <Benches userId={userId} canManage profiles={profiles} bookableCells={null} />;
}

function Benches({
  userId,
  canManage,
  profiles,
  bookableCells,
}: {
  userId: number;
  canManage: boolean;
  profiles: readonly { id: number; name: string }[];
  bookableCells: Parameters<typeof BookingCalendar>[0]['bookableCells'];
}) {
  const openedAt = useOpenedAt();
  const [params] = useSearchParams();
  const { from, to } = weekFromParams(params, openedAt);
  const bookings = useBookings({ from, to });
  return (
    <BenchesOverview
      canManage={canManage}
      canBook={bookableCells !== null}
      profiles={profiles}
      bookings={bookings}
      openedAt={openedAt}
      caution={<BenchCautions className="mb-5" />}
    >
      <BookingCalendar bookings={bookings} currentUserId={userId} bookableCells={bookableCells} openedAt={openedAt} />
    </BenchesOverview>
  );
}
