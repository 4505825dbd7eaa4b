import { useParams } from 'react-router';
import { addressId } from '../../lib/address-id';
import { paths } from '../../lib/paths';
import { writeUpQueryOptions } from '../../features/write-up/api/get-write-up';
import { WriteUpOverview } from '../../features/write-up/components/write-up-overview';
import { gatedPage, pageLoader } from '../page-route';

export const loader = pageLoader(paths.roundups, (queryClient, { params }) =>
  queryClient.ensureQueryData(writeUpQueryOptions(addressId(params.id))),
);

export const Component = gatedPage({ path: paths.roundups, pageName: 'Write-up' }, WriteUpPage);

function WriteUpPage() {
  return <WriteUpOverview roundupId={addressId(useParams().id)} />;
}
