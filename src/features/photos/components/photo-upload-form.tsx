import { useId, useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { UploadProgress, useCancellableUpload } from '../../../components/ui/upload-progress';
import { ChosenFile, FileField } from '../../../components/ui/file-field';
import { isApiError } from '../../../lib/api-client';
import type { FieldErrors } from '../../../lib/form-errors';
import { isUploadCancelled } from '../../../lib/upload';
import { acceptAttribute, fileTooLargeMessage, formatBytes, hasAcceptedExtension } from '../../../lib/upload-size';
import { photoUploadLimit } from '../../../../shared/upload-limits';
import { useUploadPhoto } from '../api/photos-api';
import { checkPhotoFields, emptyPhotoFields, PhotoFields, type PhotoFieldsDraft } from './photo-fields';

/** Why a chosen file cannot be sent, before a byte goes out; null when it may be. */
function fileProblem(file: File): string | null {
  if (!hasAcceptedExtension(file.name, photoUploadLimit)) {
    return `“${file.name}” is not a photo Benchwire takes. Choose a JPEG, PNG or WebP file.`;
  }
  if (file.size === 0) return `“${file.name}” is empty. Choose the photo file again.`;
  if (file.size > photoUploadLimit.maxFileBytes) return fileTooLargeMessage(file.name, file.size, photoUploadLimit);
  return null;
}

export interface PhotoUploadFormProps {
  roundupId: number;
  entryId: number;
  signInPath: string;
}

/**
 * Add one photo: the file, what it shows, a caption and the required alt text. The upload shows its progress and can
 * be cancelled; a refused file (wrong type, too large, too many pixels) is said beside the file input and everything
 * typed stays, so another file can be chosen and sent at once.
 */
export function PhotoUploadForm({ roundupId, entryId, signInPath }: PhotoUploadFormProps) {
  const inputId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [inputKey, setInputKey] = useState(0);
  const [draft, setDraft] = useState<PhotoFieldsDraft>(emptyPhotoFields);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<{ text: string; signedOut: boolean } | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const sender = useCancellableUpload();
  const upload = useUploadPhoto(roundupId, entryId);

  const choose = (chosen: File | undefined) => {
    setNotice(null);
    setMessage(null);
    setFile(chosen ?? null);
    setErrors((current) => ({ ...current, file: chosen ? (fileProblem(chosen) ?? undefined) : undefined }));
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setNotice(null);
    setMessage(null);
    const checked = checkPhotoFields(draft);
    const found: FieldErrors = { ...checked.errors };
    if (!file) found.file = 'Choose a photo (JPEG, PNG or WebP).';
    else {
      const problem = fileProblem(file);
      if (problem) found.file = problem;
    }
    setErrors(found);
    if (!file || !checked.fields || Object.values(found).some(Boolean)) return;
    upload.mutate(
      { file, fields: checked.fields, ...sender.start() },
      {
        onSuccess: (photo) => {
          setFile(null);
          setInputKey((key) => key + 1);
          setDraft(emptyPhotoFields());
          setErrors({});
          setNotice(`Photo added as number ${photo.position}.`);
        },
        onError: (error) => {
          // Typed as unknown: an UploadCancelled has the shape of any Error, so narrowing on it would hide ApiError.
          const failure: unknown = error;
          if (isUploadCancelled(failure)) {
            setNotice('Upload cancelled. The file and what you typed are still here.');
            return;
          }
          if (!isApiError(failure)) {
            setMessage({ text: 'Something went wrong. Try again.', signedOut: false });
            return;
          }
          if (failure.status === 401) {
            setMessage({ text: 'Your session ended, so the photo was not saved.', signedOut: true });
            return;
          }
          // Problems with the file itself belong beside the file input; the server's message says what to change.
          const aboutFile = failure.fields.file !== undefined || [413, 415, 422].includes(failure.status);
          const fields = { ...failure.fields };
          if (aboutFile && !fields.kind && !fields.altText && !fields.caption) fields.file = failure.message;
          setErrors(fields);
          if (!aboutFile || fields.kind || fields.altText || fields.caption) {
            setMessage({ text: failure.message, signedOut: false });
          }
        },
        onSettled: sender.settled,
      },
    );
  };

  const sending = upload.isPending;
  return (
    <form noValidate onSubmit={submit} aria-label="Add a photo" className="space-y-4">
      <div>
        <FileField
          key={inputKey}
          id={inputId}
          label="Photo file"
          accept={`${acceptAttribute(photoUploadLimit)},image/jpeg,image/png,image/webp`}
          disabled={sending}
          error={errors.file}
          description={
            <>
              JPEG, PNG or WebP up to {formatBytes(photoUploadLimit.maxFileBytes)}. It is turned upright, stripped of
              its metadata (location included) and kept in web sizes only.
            </>
          }
          onChange={(event) => choose(event.target.files?.[0])}
        />
        <ChosenFile file={file} className="mt-1" />
      </div>
      <div className="grid gap-4 md:grid-cols-3">
        <PhotoFields idPrefix="new-photo" draft={draft} onChange={setDraft} errors={errors} disabled={sending} />
      </div>
      {sender.shown && (
        <UploadProgress
          {...sender.shown}
          label="Uploading the photo"
          processingText="Uploaded. The server is turning it upright and making the web sizes…"
        />
      )}
      {message && (
        <Alert tone="danger" announce>
          {message.text}{' '}
          {message.signedOut && (
            <Link to={signInPath} className="font-semibold text-copper underline underline-offset-2">
              Sign in again
            </Link>
          )}
        </Alert>
      )}
      {notice && (
        <p role="status" className="text-sm text-ink">
          {notice}
        </p>
      )}
      <Button type="submit" variant="primary" pending={sending}>
        Add the photo
      </Button>
    </form>
  );
}
