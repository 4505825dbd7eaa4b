import { useParams } from 'react-router';
import { addressId } from '../../lib/address-id';
import { paths } from '../../lib/paths';
import { sectionQueryOptions } from '../../features/write-up/api/get-section';
import { SectionPage } from '../../features/write-up/components/section-page';
import { gatedPage, pageLoader } from '../page-route';

export const loader = pageLoader(paths.roundups, (queryClient, { params }) => {
  addressId(params.id);
  return queryClient.ensureQueryData(sectionQueryOptions(addressId(params.sectionId)));
});

export const Component = gatedPage({ path: paths.roundups, pageName: 'Write-up section' }, WriteUpSectionPage);

function WriteUpSectionPage() {
  const params = useParams();
  const sectionId = addressId(params.sectionId);
  // A new section starts a new editor: nothing from the last one carries over.
  return <SectionPage key={sectionId} roundupId={addressId(params.id)} sectionId={sectionId} />;
}
