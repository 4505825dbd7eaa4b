import { useMutation } from '@tanstack/react-query';
import { uploadFile, type UploadFile, type UploadProgress } from '../../../lib/upload';
import { catalogImportUploadLimit } from '../../../../shared/upload-limits';
import {
  catalogImportPreviewSchema,
  catalogImportResultSchema,
  type CatalogImportPreview,
  type CatalogImportResult,
} from '../../../../shared/schemas/catalog-import';
import { useChangeMutation } from '../../../lib/stale-after';

export interface CsvRequestInput {
  /** The CSV as the user gave it: a chosen file, or pasted text sent as a file of its own. */
  source: UploadFile;
  onProgress?: (progress: UploadProgress) => void;
}

/** Checks every row and says what an import would do; saves nothing. */
export function previewCatalogImport({ source, onProgress }: CsvRequestInput): Promise<CatalogImportPreview> {
  return uploadFile({
    path: '/api/catalog/import/preview',
    file: source,
    schema: catalogImportPreviewSchema,
    limit: catalogImportUploadLimit,
    onProgress,
  });
}

export interface CommitImportInput extends CsvRequestInput {
  /** From the preview of exactly this file: the same bytes go to preview and to commit. */
  checksum: string;
}

export function commitCatalogImport({ source, checksum, onProgress }: CommitImportInput): Promise<CatalogImportResult> {
  return uploadFile({
    path: '/api/catalog/import/commit',
    file: source,
    fields: { checksum },
    schema: catalogImportResultSchema,
    limit: catalogImportUploadLimit,
    onProgress,
  });
}

export function usePreviewCatalogImport() {
  return useMutation({ mutationFn: previewCatalogImport });
}

export function useCommitCatalogImport() {
  return useChangeMutation(commitCatalogImport, 'product');
}

/** The export link; the same archived/platform filters as the list, and the region whose prices fill the columns. */
export function catalogExportUrl(options: { archived?: string; platform?: string; priceRegion?: string }): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(options)) if (value) params.set(key, value);
  const query = params.toString();
  return `/api/catalog/export.csv${query ? `?${query}` : ''}`;
}
