import { Link } from 'react-router';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { useEntryPhotos } from '../api/photos-api';
import { PhotoList } from './photo-list';
import { PhotoUploadForm } from './photo-upload-form';

export interface EntryPhotosPageProps {
  roundupId: number;
  entryId: number;
  productName: string;
  roundupTitle: string;
  roundupPath: string;
  signInPath: string;
  canEdit: boolean;
}

/** The photos of one product in a roundup: adding them (testers and editors), their order, captions and alt text. */
export function EntryPhotosPage({
  roundupId,
  entryId,
  productName,
  roundupTitle,
  roundupPath,
  signInPath,
  canEdit,
}: EntryPhotosPageProps) {
  const photos = useEntryPhotos(roundupId, entryId);
  return (
    <>
      <p className="mb-2 text-sm">
        <Link to={roundupPath} className="text-copper underline-offset-2 hover:underline">
          ← {roundupTitle}
        </Link>
      </p>
      <PageHeader eyebrow="Photos" title={productName} />
      <div className="space-y-6">
        {canEdit && (
          <Panel
            title="Add a photo"
            description="Board overview, power-delivery close-ups, heatsinks, thermal images. Every photo needs alt text."
          >
            <PhotoUploadForm roundupId={roundupId} entryId={entryId} signInPath={signInPath} />
          </Panel>
        )}
        <Panel
          title="Photos"
          description={
            canEdit
              ? 'In the order readers will see them. Move a photo with its Earlier and Later buttons.'
              : 'In the order readers will see them.'
          }
        >
          <PhotoList roundupId={roundupId} entryId={entryId} photos={photos} canEdit={canEdit} />
        </Panel>
      </div>
    </>
  );
}
