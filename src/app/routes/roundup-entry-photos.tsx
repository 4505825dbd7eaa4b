import { Suspense } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { LoadingState } from '../../components/ui/loading-state';
import { paths } from '../../lib/paths';
import { productName } from '../../lib/product-name';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { entryPhotosQueryOptions } from '../../features/photos/api/photos-api';
import { EntryPhotosPage } from '../../features/photos/components/entry-photos-page';
import { roundupQueryOptions, useRoundup } from '../../features/roundups/api/get-roundup';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import { benchWorkers, may } from '../../../shared/access/roles';

function idFrom(value: string | undefined): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  return id;
}

export function loader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const roundupId = idFrom(params.id);
    const entryId = idFrom(params.entryId);
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (!user || !canOpen(paths.roundups, user.role)) return null;
    await Promise.all([
      queryClient.ensureQueryData(roundupQueryOptions(roundupId)),
      queryClient.ensureQueryData(entryPhotosQueryOptions(roundupId, entryId)),
    ]);
    return null;
  };
}

function Photos({ roundupId, entryId }: { roundupId: number; entryId: number }) {
  const user = useSession();
  const roundup = useRoundup(roundupId);
  const entry = roundup.entries.find((item) => item.id === entryId);
  if (!user) return null;
  if (!entry) throw new Response('Not found', { status: 404 });
  return (
    <EntryPhotosPage
      roundupId={roundupId}
      entryId={entryId}
      productName={productName(entry.product)}
      roundupTitle={roundup.title}
      roundupPath={paths.roundup(roundupId)}
      signInPath={paths.signIn(paths.roundupEntryPhotos(roundupId, entryId))}
      canEdit={may(user.role, benchWorkers)}
    />
  );
}

export function Component() {
  const params = useParams();
  const roundupId = idFrom(params.id);
  const entryId = idFrom(params.entryId);
  return (
    <RoleGate path={paths.roundups} pageName="Photos">
      <Suspense fallback={<LoadingState label="Loading the photos…" />}>
        <Photos roundupId={roundupId} entryId={entryId} />
      </Suspense>
    </RoleGate>
  );
}
