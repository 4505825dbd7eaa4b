import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { draftField } from '../../../components/ui/draft-field';
import type { FieldErrors } from '../../../lib/form-errors';
import { zodFieldErrors } from '../../../lib/form-errors';
import {
  photoKindLabels,
  photoKinds,
  photoUploadFieldsSchema,
  type PhotoUploadFields,
} from '../../../../shared/schemas/photos';

/** What the person types about a photo, kept as typed until it is saved. */
export interface PhotoFieldsDraft {
  kind: string;
  caption: string;
  altText: string;
}

export const emptyPhotoFields = (): PhotoFieldsDraft => ({ kind: '', caption: '', altText: '' });

const kindOptions = photoKinds.map((kind) => ({ value: kind, label: photoKindLabels[kind] }));

/** Checks the fields with the same schema the server uses; the server checks them again. */
export function checkPhotoFields(draft: PhotoFieldsDraft): { errors: FieldErrors; fields: PhotoUploadFields | null } {
  const parsed = photoUploadFieldsSchema.safeParse(draft);
  if (!parsed.success) return { errors: zodFieldErrors(parsed.error), fields: null };
  return { errors: {}, fields: parsed.data };
}

/** Kind, caption and the required alt text of a photo. */
export function PhotoFields({
  idPrefix,
  draft,
  onChange,
  errors,
  disabled,
}: {
  idPrefix: string;
  draft: PhotoFieldsDraft;
  onChange: (draft: PhotoFieldsDraft) => void;
  errors: FieldErrors;
  disabled?: boolean;
}) {
  const field = draftField(draft, onChange, errors);
  return (
    <>
      <Select
        id={`${idPrefix}-kind`}
        label="What it shows"
        placeholder="Choose…"
        options={kindOptions}
        {...field('kind')}
        disabled={disabled}
      />
      <TextField
        id={`${idPrefix}-caption`}
        label="Caption"
        optional
        description="Shown under the photo, e.g. what to notice."
        {...field('caption')}
        maxLength={300}
        disabled={disabled}
      />
      <TextField
        id={`${idPrefix}-alt`}
        label="Alt text"
        description="What a screen reader says instead of the photo: what is in it, in a sentence."
        {...field('altText')}
        maxLength={300}
        disabled={disabled}
      />
    </>
  );
}
