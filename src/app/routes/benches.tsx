import type { QueryClient } from '@tanstack/react-query';
import { useLoaderData, type LoaderFunctionArgs } from 'react-router';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { benchProfileOptionsQueryOptions, useBenchProfileOptions } from '../../features/benches/api/get-bench-profiles';
import { benchesQueryOptions } from '../../features/benches/api/get-benches';
import { bookableCellsQueryOptions, useBookableCells } from '../../features/benches/api/get-bookable-cells';
import { bookingsQueryOptions } from '../../features/benches/api/get-bookings';
import { weekFromParams } from '../../features/benches/components/bench-time';
import { BenchesOverview } from '../../features/benches/components/benches-overview';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import type { Role } from '../../../shared/schemas/common';

// Mirrors server/routes/planning-access.ts: editors manage benches, bench testers book them.
const canManageBenches = (role: Role) => role === 'editor';
const canBook = (role: Role) => role === 'tester';

export function loader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    const openedAt = Date.now();
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (user && canOpen(paths.benches, user.role)) {
      const { from, to } = weekFromParams(new URL(request.url).searchParams, openedAt);
      await Promise.all([
        queryClient.ensureQueryData(benchesQueryOptions()),
        queryClient.ensureQueryData(bookingsQueryOptions({ from, to })),
        canBook(user.role) ? queryClient.ensureQueryData(bookableCellsQueryOptions()) : null,
        canManageBenches(user.role) ? queryClient.ensureQueryData(benchProfileOptionsQueryOptions()) : null,
      ]);
    }
    return { openedAt };
  };
}

export function Component() {
  return (
    <RoleGate path={paths.benches} pageName="Benches">
      <BenchesPage />
    </RoleGate>
  );
}

function BenchesPage() {
  const user = useSession();
  const { openedAt } = useLoaderData() as { openedAt: number };
  if (!user) return null;
  if (canBook(user.role)) return <TesterBenches userId={user.id} openedAt={openedAt} />;
  if (canManageBenches(user.role)) return <EditorBenches userId={user.id} openedAt={openedAt} />;
  return (
    <BenchesOverview currentUserId={user.id} canManage={false} bookableCells={null} profiles={[]} openedAt={openedAt} />
  );
}

function TesterBenches({ userId, openedAt }: { userId: number; openedAt: number }) {
  const cells = useBookableCells();
  return (
    <BenchesOverview currentUserId={userId} canManage={false} bookableCells={cells} profiles={[]} openedAt={openedAt} />
  );
}

function EditorBenches({ userId, openedAt }: { userId: number; openedAt: number }) {
  const profiles = useBenchProfileOptions();
  return (
    <BenchesOverview currentUserId={userId} canManage bookableCells={null} profiles={profiles} openedAt={openedAt} />
  );
}
