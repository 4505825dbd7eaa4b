import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from '../errors';
import { formatUploadBytes, type UploadLimit } from '../../shared/upload-limits';

export type MultipartFieldKind = 'file' | 'json' | 'string';

/**
 * What a multipart route takes: its fields by name and kind, and the limits from shared/upload-limits. `json` fields
 * arrive parsed in req.body (400 naming the field when they are not JSON). `orJson`: the route also takes its text
 * fields as an application/json body (the catalog import takes the CSV as text).
 */
export interface MultipartSpec {
  fields: Record<string, MultipartFieldKind>;
  limit: UploadLimit;
  orJson?: boolean;
}

const quoted = (name: string) => `“${name}”`;
const listOf = (names: string[]) =>
  names.length === 0 ? 'no text fields' : names.length === 1 ? quoted(names[0]) : names.map(quoted).join(', ');

function fieldNames(spec: MultipartSpec, kind: 'file' | 'text'): string[] {
  return Object.entries(spec.fields)
    .filter(([, fieldKind]) => (kind === 'file') === (fieldKind === 'file'))
    .map(([name]) => name);
}

/** Errors busboy raises on a body that is not well-formed multipart (multer passes them on unchanged). */
const malformedMultipart = [
  /^Multipart: Boundary not found$/,
  /^Malformed content type$/,
  /^Malformed part header$/,
  /^Unexpected end of (form|file)$/,
];

/**
 * Every error multer and busboy raise, as an AppError with a status (413 for sizes, 400 for the rest) and a message
 * that says what to change. `spec` adds the route's own limits and field names to the message when known.
 */
export function uploadError(error: unknown, spec?: MultipartSpec): AppError | null {
  if (error instanceof multer.MulterError) {
    const field = error.field ?? 'file';
    const files = spec ? fieldNames(spec, 'file') : [];
    const texts = spec ? fieldNames(spec, 'text') : [];
    const limit = spec?.limit;
    // Typed loosely: multer 2 raises codes its type definitions do not list yet.
    switch (error.code as string) {
      case 'LIMIT_FILE_SIZE':
        return new AppError(
          'file_too_large',
          413,
          limit
            ? `The file is larger than ${formatUploadBytes(limit.maxFileBytes)}, the most this upload takes. ${limit.whenTooLarge}`
            : 'The file is larger than this upload takes. Upload a smaller file.',
          { [field]: limit ? `At most ${formatUploadBytes(limit.maxFileBytes)}.` : 'The file is too large.' },
        );
      case 'LIMIT_FIELD_VALUE':
        return new AppError(
          'field_too_large',
          413,
          `The form field ${quoted(field)} is longer than ${limit ? formatUploadBytes(limit.maxFieldBytes) : 'this upload takes'}. Send a shorter value.`,
          { [field]: 'Too long.' },
        );
      case 'LIMIT_FIELD_KEY':
        return new AppError(
          'invalid_field_name',
          400,
          'A form field name is too long. Use the field names this upload takes.',
        );
      case 'LIMIT_UNEXPECTED_FILE':
        return new AppError(
          'unexpected_file',
          400,
          files.length > 0
            ? `This upload takes its file in the field ${listOf(files)}, not ${quoted(field)}. Rename the form field.`
            : `The form field ${quoted(field)} may not hold a file here.`,
          { [field]: 'Not a file field of this upload.' },
        );
      case 'LIMIT_FILE_COUNT':
        return new AppError(
          'too_many_files',
          400,
          `Send ${limit?.maxFiles === 1 || !limit ? 'one file' : `at most ${limit.maxFiles} files`} per upload; this request had more.`,
        );
      case 'LIMIT_FIELD_COUNT':
        return new AppError(
          'too_many_fields',
          400,
          `The form has too many text fields: this upload takes ${listOf(texts)} besides the file. Remove the others.`,
        );
      case 'LIMIT_PART_COUNT':
        return new AppError(
          'too_many_parts',
          400,
          `The form has too many parts: this upload takes ${listOf([...files, ...texts])}. Remove the others.`,
        );
      case 'MISSING_FIELD_NAME':
      case 'INVALID_FIELD_NAME':
      case 'LIMIT_FIELD_NESTING':
      case 'LIMIT_FIELD_ARRAY_INDEX':
        return new AppError(
          'invalid_field_name',
          400,
          `A form field has no usable name. ${spec ? `This upload takes ${listOf([...files, ...texts])}.` : 'Name every field.'}`,
        );
      default:
        return new AppError('upload_failed', 400, 'The upload did not arrive whole. Send the file again.');
    }
  }
  if (error instanceof Error && malformedMultipart.some((pattern) => pattern.test(error.message))) {
    return error.message.includes('Boundary') || error.message.includes('content type')
      ? new AppError(
          'multipart_malformed',
          400,
          'The Content-Type header names multipart/form-data without a usable boundary. Let the browser or HTTP library build the form instead of writing the header by hand.',
        )
      : new AppError(
          'multipart_malformed',
          400,
          'The upload ended before the whole form arrived, or a part of it is malformed. Send the file again.',
        );
  }
  return null;
}

function isMultipart(contentType: string | undefined): boolean {
  return /^multipart\/form-data(\s*;|$)/i.test(contentType?.trim() ?? '');
}

function isJson(contentType: string | undefined): boolean {
  return /^application\/json(\s*;|$)/i.test(contentType?.trim() ?? '');
}

/**
 * The one multer set-up. The file stays in memory (every route reads it whole, within its limit); the request is
 * refused with 415 before any of it is read when it is not multipart/form-data (or JSON, on routes that also take the
 * text in a JSON body); every multer and busboy error becomes a 4xx; text fields the route does not take are refused
 * by name.
 */
export function acceptUpload(spec: MultipartSpec): RequestHandler[] {
  const alsoJson = spec.orJson === true;
  const files = fieldNames(spec, 'file');
  const texts = fieldNames(spec, 'text');
  const parser = multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: spec.limit.maxFileBytes,
      files: spec.limit.maxFiles,
      fields: spec.limit.maxFields,
      fieldSize: spec.limit.maxFieldBytes,
      parts: spec.limit.maxFiles + spec.limit.maxFields,
      fieldNameSize: 100,
      headerPairs: 100,
    },
  }).fields(files.map((name) => ({ name, maxCount: 1 })));

  const checkContentType: RequestHandler = (req, _res, next) => {
    const contentType = req.headers['content-type'];
    if (isMultipart(contentType) || (alsoJson && isJson(contentType))) return next();
    next(
      new AppError(
        'unsupported_media_type',
        415,
        `Send the file as multipart/form-data in the field ${listOf(files)}${alsoJson ? ', or the text as application/json' : ''}; this request was ${contentType ? `“${contentType.split(';')[0]}”` : 'sent without a Content-Type'}.`,
      ),
    );
  };

  const parse: RequestHandler = (req, res, next) => {
    if (!isMultipart(req.headers['content-type'])) return next();
    parser(req, res, (error?: unknown) => {
      if (error) return next(uploadError(error, spec) ?? error);
      const unexpected = Object.keys(req.body ?? {}).filter((name) => !texts.includes(name));
      if (unexpected.length > 0) {
        return next(
          new AppError(
            'unexpected_field',
            400,
            `This upload does not take the field${unexpected.length === 1 ? '' : 's'} ${listOf(unexpected)}; it takes ${listOf(texts)} besides the file.`,
            Object.fromEntries(unexpected.map((name) => [name, 'Not a field of this upload.'])),
          ),
        );
      }
      for (const [name, kind] of Object.entries(spec.fields)) {
        const value: unknown = req.body[name];
        if (kind !== 'json' || typeof value !== 'string') continue;
        try {
          req.body[name] = value.trim() === '' ? undefined : JSON.parse(value);
        } catch {
          return next(
            new AppError('validation_failed', 400, `The form field ${quoted(name)} is not valid JSON.`, {
              [name]: 'Not valid JSON.',
            }),
          );
        }
      }
      // A route with one file field reads it as req.file, the way multer's single() leaves it.
      const uploaded = req.files as Record<string, Express.Multer.File[]> | undefined;
      if (files.length === 1) req.file = uploaded?.[files[0]]?.[0];
      next();
    });
  };

  return [checkContentType, parse];
}
