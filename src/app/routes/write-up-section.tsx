import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { paths } from '../../lib/paths';
import { sessionQueryOptions } from '../../features/auth/api/get-session';
import { sectionQueryOptions } from '../../features/write-up/api/get-section';
import { SectionPage } from '../../features/write-up/components/section-page';
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
    const sectionId = idFrom(params.sectionId);
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (!user || !canOpen(paths.roundups, user.role)) return null;
    await queryClient.ensureQueryData(sectionQueryOptions(sectionId));
    return null;
  };
}

export function Component() {
  const params = useParams();
  const sectionId = idFrom(params.sectionId);
  return (
    <RoleGate path={paths.roundups} pageName="Write-up section">
      {/* A new section starts a new editor: nothing from the last one carries over. */}
      <SectionPage key={sectionId} roundupId={idFrom(params.id)} sectionId={sectionId} />
    </RoleGate>
  );
}
