import { addressId } from '../../lib/address-id';
import { paths } from '../../lib/paths';
import { productDisplayName } from '../../../shared/domain/planning/product-display-name';
import { entryPhotosQueryOptions } from '../../features/photos/api/photos-api';
import { EntryPhotosPage } from '../../features/photos/components/entry-photos-page';
import { useRoundup } from '../../features/roundups/api/get-roundup';
import { benchWorkers, may } from '../../../shared/access/roles';
import { roundupPage, roundupPageLoader, type RoundupPageProps } from '../page-route';

export const loader = roundupPageLoader((queryClient, roundupId, { params }) => [
  queryClient.ensureQueryData(entryPhotosQueryOptions(roundupId, addressId(params.entryId))),
]);

export const Component = roundupPage({ pageName: 'Photos', loading: 'Loading the photos…' }, Photos);

function Photos({ user, roundupId, params }: RoundupPageProps) {
  const entryId = addressId(params.entryId);
  const roundup = useRoundup(roundupId);
  const entry = roundup.entries.find((item) => item.id === entryId);
  if (!entry) throw new Response('Not found', { status: 404 });
  return (
    <EntryPhotosPage
      roundupId={roundupId}
      entryId={entryId}
      productName={productDisplayName(entry.product)}
      roundupTitle={roundup.title}
      roundupPath={paths.roundup(roundupId)}
      signInPath={paths.signIn(paths.roundupEntryPhotos(roundupId, entryId))}
      canEdit={may(user.role, benchWorkers)}
    />
  );
}
