import { addressId } from '../../lib/address-id';
import { paths } from '../../lib/paths';
import { matrixQueryOptions, useMatrix } from '../../features/matrix/api/get-matrix';
import { useTransitionCell } from '../../features/matrix/api/transition-cell';
import { cellRunsQueryOptions } from '../../features/test-runs/api/test-runs-api';
import { CellRunsPage } from '../../features/test-runs/components/cell-runs-page';
import { pageLoader, roundupPage, type RoundupPageProps } from '../page-route';

export const loader = pageLoader(paths.roundups, (queryClient, { params }) =>
  Promise.all([
    queryClient.ensureQueryData(cellRunsQueryOptions(addressId(params.cellId))),
    queryClient.ensureQueryData(matrixQueryOptions(addressId(params.id))),
  ]),
);

export const Component = roundupPage({ pageName: 'Test runs', loading: 'Loading the runs…' }, CellRuns);

function CellRuns({ user, roundupId, params }: RoundupPageProps) {
  const cellId = addressId(params.cellId);
  const matrix = useMatrix(roundupId);
  const transition = useTransitionCell();
  const here = paths.roundupCell(roundupId, cellId);
  const matrixCell = matrix.rows.flatMap((row) => row.cells).find((cell) => cell.id === cellId) ?? null;
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
