import { useState, type FormEvent } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { describeSubmitError, type FieldErrors } from '../../../lib/form-errors';
import { formatInstant } from '../../../lib/format-time';
import { photoKindLabels, type Photo } from '../../../../shared/schemas/photos';
import { useRemovePhoto, useReorderPhotos, useUpdatePhoto } from '../api/photos-api';
import { checkPhotoFields, PhotoFields, type PhotoFieldsDraft } from './photo-fields';

/** The smallest web sizes as a responsive thumbnail: WebP where the browser reads it, JPEG otherwise. */
function Thumbnail({ photo }: { photo: Photo }) {
  const bySize = (format: 'webp' | 'jpeg') =>
    photo.sizes.filter((size) => size.format === format).sort((a, b) => a.width - b.width);
  const webp = bySize('webp');
  const jpeg = bySize('jpeg');
  const fallback = jpeg[0] ?? webp[0];
  if (!fallback) return <div className="aspect-[4/3] bg-wash" aria-hidden="true" />;
  const srcSet = (sizes: typeof webp) => sizes.map((size) => `${size.url} ${size.width}w`).join(', ');
  return (
    <picture>
      {webp.length > 0 && <source type="image/webp" srcSet={srcSet(webp)} sizes="(min-width: 48rem) 18rem, 100vw" />}
      <img
        src={fallback.url}
        srcSet={jpeg.length > 0 ? srcSet(jpeg) : undefined}
        sizes="(min-width: 48rem) 18rem, 100vw"
        width={fallback.width}
        height={fallback.height}
        alt={photo.altText}
        loading="lazy"
        className="aspect-[4/3] h-auto w-full bg-wash object-contain"
      />
    </picture>
  );
}

function EditPhotoForm({ photo, onDone }: { photo: Photo; onDone: (saved: boolean) => void }) {
  const [draft, setDraft] = useState<PhotoFieldsDraft>({
    kind: photo.kind,
    caption: photo.caption,
    altText: photo.altText,
  });
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const update = useUpdatePhoto();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setMessage(null);
    const checked = checkPhotoFields(draft);
    setErrors(checked.errors);
    if (!checked.fields) return;
    update.mutate(
      { photoId: photo.id, fields: checked.fields },
      {
        onSuccess: () => onDone(true),
        onError: (error) => {
          const described = describeSubmitError(error);
          setErrors(described.fields);
          setMessage(described.message);
        },
      },
    );
  };

  return (
    <form noValidate onSubmit={submit} aria-label={`Edit photo ${photo.position}`} className="space-y-3">
      <PhotoFields idPrefix={`photo-${photo.id}`} draft={draft} onChange={setDraft} errors={errors} />
      {message && (
        <Alert tone="danger" announce>
          {message}
        </Alert>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" size="sm" variant="primary" pending={update.isPending}>
          Save
        </Button>
        <Button type="button" size="sm" onClick={() => onDone(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export interface PhotoListProps {
  roundupId: number;
  entryId: number;
  photos: Photo[];
  /** Testers and editors change photos; other staff see them. */
  canEdit: boolean;
}

/**
 * The product's photos in order. Each moves one place earlier or later with its own buttons (keyboard and screen
 * reader friendly; the new place is read out), is edited in place, or removed after a confirmation.
 */
export function PhotoList({ roundupId, entryId, photos, canEdit }: PhotoListProps) {
  const [editingId, setEditingId] = useState<number | null>(null);
  const [removing, setRemoving] = useState<Photo | null>(null);
  const [removeError, setRemoveError] = useState<string | undefined>();
  const [announcement, setAnnouncement] = useState('');
  const [error, setError] = useState<string | null>(null);
  const reorder = useReorderPhotos(roundupId, entryId);
  const remove = useRemovePhoto();

  const move = (index: number, by: -1 | 1) => {
    const target = index + by;
    if (target < 0 || target >= photos.length) return;
    const ids = photos.map((photo) => photo.id);
    [ids[index], ids[target]] = [ids[target], ids[index]];
    setError(null);
    setAnnouncement(`Photo moved to place ${target + 1} of ${photos.length}.`);
    reorder.mutate(ids, {
      onError: (failure) => {
        setAnnouncement('');
        setError(`The new order was not saved. ${describeSubmitError(failure).message}`);
      },
    });
  };

  const confirmRemove = () => {
    if (!removing) return;
    remove.mutate(removing.id, {
      onSuccess: () => {
        setRemoving(null);
        setAnnouncement('Photo removed.');
      },
      onError: (failure) => setRemoveError(describeSubmitError(failure).message),
    });
  };

  if (photos.length === 0) {
    return (
      <EmptyState title="No photos yet">
        {canEdit
          ? 'Add the board overview first, then close-ups and thermal images.'
          : 'Testers add them while testing.'}
      </EmptyState>
    );
  }

  return (
    <div className="space-y-3">
      <p className="sr-only" aria-live="polite">
        {announcement}
      </p>
      {error && (
        <Alert tone="danger" announce>
          {error}
        </Alert>
      )}
      <ol aria-label="Photos in order" className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {photos.map((photo, index) => {
          const name = `photo ${index + 1}${photo.caption ? ` (${photo.caption})` : ''}`;
          return (
            <li key={photo.id} className="flex flex-col rounded-[3px] border border-rule bg-surface">
              <Thumbnail photo={photo} />
              <div className="flex flex-1 flex-col gap-2 p-3 text-sm">
                {editingId === photo.id ? (
                  <EditPhotoForm
                    photo={photo}
                    onDone={(saved) => {
                      setEditingId(null);
                      if (saved) setAnnouncement('Photo details saved.');
                    }}
                  />
                ) : (
                  <>
                    <p className="font-semibold text-ink">
                      <span className="numeric mr-1.5 text-muted">{index + 1}.</span>
                      {photoKindLabels[photo.kind]}
                    </p>
                    {photo.caption && <p className="text-ink">{photo.caption}</p>}
                    <p className="text-[0.8125rem] text-muted">
                      Alt text: <span className="text-ink">{photo.altText}</span>
                    </p>
                    <p className="numeric text-[0.8125rem] text-muted">
                      {photo.width} × {photo.height}&thinsp;px · {photo.uploadedBy.displayName},{' '}
                      {formatInstant(photo.createdAt)}
                    </p>
                  </>
                )}
                {canEdit && editingId !== photo.id && (
                  <div className="mt-auto flex flex-wrap gap-1.5 pt-1">
                    <Button
                      size="sm"
                      aria-label={`Move ${name} earlier`}
                      aria-disabled={index === 0 || undefined}
                      className="aria-disabled:opacity-55"
                      onClick={() => move(index, -1)}
                    >
                      <span aria-hidden="true">←</span> Earlier
                    </Button>
                    <Button
                      size="sm"
                      aria-label={`Move ${name} later`}
                      aria-disabled={index === photos.length - 1 || undefined}
                      className="aria-disabled:opacity-55"
                      onClick={() => move(index, 1)}
                    >
                      Later <span aria-hidden="true">→</span>
                    </Button>
                    <Button size="sm" aria-label={`Edit ${name}`} onClick={() => setEditingId(photo.id)}>
                      Edit
                    </Button>
                    <Button
                      size="sm"
                      variant="danger"
                      aria-label={`Remove ${name}`}
                      onClick={() => {
                        setRemoveError(undefined);
                        setRemoving(photo);
                      }}
                    >
                      Remove
                    </Button>
                  </div>
                )}
              </div>
            </li>
          );
        })}
      </ol>
      <ConfirmDialog
        open={removing !== null}
        title="Remove this photo?"
        confirmLabel="Remove the photo"
        pending={remove.isPending}
        error={removeError}
        onConfirm={confirmRemove}
        onCancel={() => setRemoving(null)}
      >
        <p>The photo and all its web sizes are deleted. To use it again, upload the file again.</p>
      </ConfirmDialog>
    </div>
  );
}
