import type { QueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { ForbiddenState } from '../../components/ui/forbidden-state';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { benchProfilesQueryOptions } from '../../features/roundups/api/get-bench-profiles';
import { loadConfigurationsQueryOptions } from '../../features/roundups/api/get-load-configurations';
import { CreateRoundupForm } from '../../features/roundups/components/create-roundup-form';
import { roleLabels } from '../../../shared/schemas/common';
import { may, planEditors } from '../../../shared/access/roles';

export function loader(queryClient: QueryClient) {
  return async () => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (user && may(user.role, planEditors)) {
      await Promise.all([
        queryClient.ensureQueryData(benchProfilesQueryOptions()),
        queryClient.ensureQueryData(loadConfigurationsQueryOptions()),
      ]);
    }
    return null;
  };
}

export function Component() {
  const user = useSession();
  const navigate = useNavigate();
  if (!user) return null;
  // Planning a roundup is an editor's job; the server refuses everyone else too.
  if (!may(user.role, planEditors)) return <ForbiddenState pageName="New roundup" roleLabel={roleLabels[user.role]} />;
  return (
    <>
      <PageHeader
        eyebrow="Roundups"
        title="New roundup"
        description="The roundup starts in Planning. Add the products from the catalog once it exists."
      />
      <CreateRoundupForm
        onCreated={(roundup) => void navigate(paths.roundup(roundup.id), { state: { created: true } })}
        onCancel={() => void navigate(paths.roundups)}
      />
    </>
  );
}
