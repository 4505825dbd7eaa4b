import { Suspense } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { LoadingState } from '../../components/ui/loading-state';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { matrixQueryOptions, useMatrix } from '../../features/matrix/api/get-matrix';
import { useTransitionCell } from '../../features/matrix/api/transition-cell';
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
    const roundupId = idFrom(params.id);
    const cellId = idFrom(params.cellId);
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (!user || !canOpen(paths.roundups, user.role)) return null;
    await Promise.all([
      queryClient.ensureQueryData(cellRunsQueryOptions(cellId)),
      queryClient.ensureQueryData(matrixQueryOptions(roundupId)),
    ]);
    return null;
  };
}

function CellPage({ roundupId, cellId }: { roundupId: number; cellId: number }) {
  const user = useSession();
  const matrix = useMatrix(roundupId);
  const transition = useTransitionCell();
  const here = paths.roundupCell(roundupId, cellId);
  const matrixCell = matrix.rows.flatMap((row) => row.cells).find((cell) => cell.id === cellId) ?? null;
  if (!user) return null;
  return (
    <CellRunsPage
      cellId={cellId}
      matrixCell={matrixCell}
      moveCell={(action) => transition.mutateAsync({ roundupId, cellId, action })}
      matrixPath={`${paths.roundup(roundupId)}?tab=matrix`}
      photosPath={(entryId) => paths.roundupEntryPhotos(roundupId, entryId)}
      signInPath={paths.signIn(here)}
      canRecord={user.role === 'tester'}
    />
  );
}

export function Component() {
  const params = useParams();
  const roundupId = idFrom(params.id);
  const cellId = idFrom(params.cellId);
  return (
    <RoleGate path={paths.roundups} pageName="Test runs">
      <Suspense fallback={<LoadingState label="Loading the runs…" />}>
        <CellPage roundupId={roundupId} cellId={cellId} />
      </Suspense>
    </RoleGate>
  );
}
