import { addressId } from '../../lib/address-id';
import { paths } from '../../lib/paths';
import { sectionQueryOptions } from '../../features/write-up/api/get-section';
import { SectionPage } from '../../features/write-up/components/section-page';
import { pageLoader, roundupPage, type RoundupPageProps } from '../page-route';

export const loader = pageLoader(paths.roundups, (queryClient, { params }) => {
  addressId(params.id);
  return queryClient.ensureQueryData(sectionQueryOptions(addressId(params.sectionId)));
});

export const Component = roundupPage({ pageName: 'Write-up section' }, WriteUpSectionPage);

function WriteUpSectionPage({ roundupId, params }: RoundupPageProps) {
  const sectionId = addressId(params.sectionId);
  // A new section starts a new editor: nothing from the last one carries over.
  return <SectionPage key={sectionId} roundupId={roundupId} sectionId={sectionId} />;
}
