import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { paths } from '../../lib/paths';
import { sessionQueryOptions } from '../../features/auth/api/get-session';
import { writeUpQueryOptions } from '../../features/write-up/api/get-write-up';
import { WriteUpOverview } from '../../features/write-up/components/write-up-overview';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';

function idFrom(value: string | undefined): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  return id;
}

export function loader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const id = idFrom(params.id);
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (!user || !canOpen(paths.roundups, user.role)) return null;
    await queryClient.ensureQueryData(writeUpQueryOptions(id));
    return null;
  };
}

export function Component() {
  const params = useParams();
  return (
    <RoleGate path={paths.roundups} pageName="Write-up">
      <WriteUpOverview roundupId={idFrom(params.id)} />
    </RoleGate>
  );
}
