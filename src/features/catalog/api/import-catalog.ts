import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { ApiError } from '../../../lib/api-client';
import { apiErrorSchema } from '../../../../shared/schemas/common';
import {
  CATALOG_IMPORT_MAX_BYTES,
  catalogImportPreviewSchema,
  catalogImportResultSchema,
  type CatalogImportPreview,
  type CatalogImportResult,
} from '../../../../shared/schemas/catalog-import';
import { catalogKeys } from './catalog-keys';

export interface UploadProgress {
  /** 'uploading' while bytes go out; 'processing' once all are sent and the server works on the file. */
  phase: 'uploading' | 'processing';
  loadedBytes: number;
  /** Null when the browser cannot tell the size of the request. */
  totalBytes: number | null;
}

/** The CSV as the user gave it: a chosen file, or pasted text sent as a file of its own. */
export interface CsvSource {
  blob: Blob;
  fileName: string;
}

export interface CsvRequestInput {
  source: CsvSource;
  onProgress?: (progress: UploadProgress) => void;
}

const networkMessage = 'Benchwire could not reach the server. Check the connection and try again.';

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

function errorFrom(status: number, body: unknown): ApiError {
  const parsed = apiErrorSchema.safeParse(body);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError(status, code, message, fields ?? {});
  }
  if (status === 413) {
    const limit = Math.round(CATALOG_IMPORT_MAX_BYTES / 1000);
    return new ApiError(status, 'payload_too_large', `The file is larger than one import takes (${limit} kB).`);
  }
  return new ApiError(
    status,
    `http_${status}`,
    status >= 500 ? 'Something went wrong on the server.' : 'The server sent an answer this page does not understand.',
  );
}

/**
 * Sends the CSV as multipart/form-data with XMLHttpRequest, because only XHR reports upload progress. The same
 * bytes go to preview and to commit, so the checksum the preview returned matches the file being committed.
 */
function postCsv<T>(path: string, form: FormData, schema: z.ZodType<T>, onProgress?: CsvRequestInput['onProgress']) {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', path);
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.addEventListener('progress', (event) => {
      onProgress?.({
        phase: 'uploading',
        loadedBytes: event.loaded,
        totalBytes: event.lengthComputable ? event.total : null,
      });
    });
    xhr.upload.addEventListener('load', () => {
      onProgress?.({ phase: 'processing', loadedBytes: 0, totalBytes: null });
    });
    xhr.addEventListener('error', () => reject(new ApiError(0, 'network_error', networkMessage)));
    xhr.addEventListener('load', () => {
      const body = parseJson(xhr.responseText);
      if (xhr.status < 200 || xhr.status >= 300) {
        reject(errorFrom(xhr.status, body));
        return;
      }
      const checked = schema.safeParse(body);
      if (checked.success) resolve(checked.data);
      else reject(errorFrom(xhr.status, null));
    });
    xhr.send(form);
  });
}

export function previewCatalogImport({ source, onProgress }: CsvRequestInput): Promise<CatalogImportPreview> {
  const form = new FormData();
  form.append('file', source.blob, source.fileName);
  return postCsv('/api/catalog/import/preview', form, catalogImportPreviewSchema, onProgress);
}

export interface CommitImportInput extends CsvRequestInput {
  /** From the preview of exactly this file. */
  checksum: string;
}

export function commitCatalogImport({ source, checksum, onProgress }: CommitImportInput): Promise<CatalogImportResult> {
  const form = new FormData();
  form.append('checksum', checksum);
  form.append('file', source.blob, source.fileName);
  return postCsv('/api/catalog/import/commit', form, catalogImportResultSchema, onProgress);
}

export function usePreviewCatalogImport() {
  return useMutation({ mutationFn: previewCatalogImport });
}

export function useCommitCatalogImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: commitCatalogImport,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: catalogKeys.all }),
  });
}

/** The export link; the same archived/platform filters as the list, and the region whose prices fill the columns. */
export function catalogExportUrl(options: { archived?: string; platform?: string; priceRegion?: string }): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(options)) if (value) params.set(key, value);
  const query = params.toString();
  return `/api/catalog/export.csv${query ? `?${query}` : ''}`;
}
