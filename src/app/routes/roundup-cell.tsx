import { Suspense } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { LoadingState } from '../../components/ui/loading-state';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { cellRunsQueryOptions } from '../../features/test-runs/api/test-runs-api';
import { CellRunsPage } from '../../features/test-runs/components/cell-runs-page';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';

function idFrom(value: string | undefined): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  return id;
}

export function loader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    idFrom(params.id);
    const cellId = idFrom(params.cellId);
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (!user || !canOpen(paths.roundups, user.role)) return null;
    await queryClient.ensureQueryData(cellRunsQueryOptions(cellId));
    return null;
  };
}

export function Component() {
  const params = useParams();
  const roundupId = idFrom(params.id);
  const cellId = idFrom(params.cellId);
  const user = useSession();
  const here = paths.roundupCell(roundupId, cellId);
  return (
    <RoleGate path={paths.roundups} pageName="Test runs">
      <Suspense fallback={<LoadingState label="Loading the runs…" />}>
        {user && (
          <CellRunsPage
            cellId={cellId}
            matrixPath={`${paths.roundup(roundupId)}?tab=matrix`}
            signInPath={paths.signIn(here)}
            canRecord={user.role === 'tester'}
          />
        )}
      </Suspense>
    </RoleGate>
  );
}
