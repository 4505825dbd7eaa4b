import { addressId } from '../../lib/address-id';
import { paths } from '../../lib/paths';
import { writeUpQueryOptions } from '../../features/write-up/api/get-write-up';
import { WriteUpOverview } from '../../features/write-up/components/write-up-overview';
import { pageLoader, roundupPage, type RoundupPageProps } from '../page-route';

export const loader = pageLoader(paths.roundups, (queryClient, { params }) =>
  queryClient.ensureQueryData(writeUpQueryOptions(addressId(params.id))),
);

export const Component = roundupPage({ pageName: 'Write-up' }, WriteUpPage);

function WriteUpPage({ roundupId }: RoundupPageProps) {
  return <WriteUpOverview roundupId={roundupId} />;
}
