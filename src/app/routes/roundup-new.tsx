import { useNavigate } from 'react-router';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { benchProfilesQueryOptions } from '../../features/roundups/api/bench-profiles';
import { loadConfigurationsQueryOptions } from '../../features/roundups/api/load-configurations';
import { CreateRoundupForm } from '../../features/roundups/components/create-roundup-form';
import { may, planEditors } from '../../../shared/access/roles';
import { gatedPage, pageLoader } from '../page-route';

export const loader = pageLoader(paths.roundups, (queryClient, _args, user) =>
  may(user.role, planEditors)
    ? Promise.all([
        queryClient.ensureQueryData(benchProfilesQueryOptions()),
        queryClient.ensureQueryData(loadConfigurationsQueryOptions()),
      ])
    : Promise.resolve(),
);

// Planning a roundup is an editor's job; the server refuses everyone else too.
export const Component = gatedPage(
  { path: paths.roundups, pageName: 'New roundup', rule: planEditors },
  NewRoundupPage,
);

function NewRoundupPage() {
  const navigate = useNavigate();
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
