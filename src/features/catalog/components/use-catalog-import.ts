import { useReducer } from 'react';
import { describeSubmitError } from '../../../lib/form-errors';
import { isUploadCancelled, type UploadFile, type UploadProgress } from '../../../lib/upload';
import { fileTooLargeMessage } from '../../../lib/upload-size';
import type { CatalogImportPreview, CatalogImportResult } from '../../../../shared/schemas/catalog-import';
import { catalogImportUploadLimit } from '../../../../shared/upload-limits';
import { useCommitCatalogImport, usePreviewCatalogImport } from '../api/import-catalog';

export type CsvSourceMode = 'file' | 'paste';

export interface CheckedImport {
  preview: CatalogImportPreview;
  /** Exactly what was previewed; the commit sends the same bytes with the preview's checksum. */
  source: UploadFile;
}

export interface CatalogImportState {
  mode: CsvSourceMode;
  file: File | null;
  /** Changes when the file input must be emptied (after an import), so it is drawn afresh. */
  fileInputKey: number;
  pasted: string;
  /** What is wrong with the file or the text, shown beside it. */
  sourceError: string | null;
  checked: CheckedImport | null;
  sending: { step: 'preview' | 'commit'; progress: UploadProgress } | null;
  requestError: string | null;
  result: CatalogImportResult | null;
}

type Action =
  | { type: 'mode-chosen'; mode: CsvSourceMode }
  | { type: 'file-chosen'; file: File | null }
  | { type: 'text-edited'; text: string; mode?: CsvSourceMode }
  | { type: 'discarded' }
  | { type: 'source-refused'; message: string }
  | { type: 'sent'; step: 'preview' | 'commit'; totalBytes: number }
  | { type: 'progressed'; progress: UploadProgress }
  | { type: 'checked'; checked: CheckedImport }
  | { type: 'imported'; result: CatalogImportResult }
  | { type: 'failed'; message: string }
  | { type: 'settled' };

export const initialCatalogImportState: CatalogImportState = {
  mode: 'file',
  file: null,
  fileInputKey: 0,
  pasted: '',
  sourceError: null,
  checked: null,
  sending: null,
  requestError: null,
  result: null,
};

// A preview belongs to the exact text it checked: any change to the input sets it aside.
const setAside = { checked: null, requestError: null, sourceError: null, result: null } as const;

/** Import in two steps: check (nothing saved; row problems listed) → fix and check again → confirm (all rows or none). */
export function catalogImportReducer(state: CatalogImportState, action: Action): CatalogImportState {
  switch (action.type) {
    case 'mode-chosen':
      return { ...state, ...setAside, mode: action.mode };
    case 'file-chosen':
      return { ...state, ...setAside, file: action.file };
    case 'text-edited':
      return { ...state, ...setAside, pasted: action.text, mode: action.mode ?? state.mode };
    case 'discarded':
      return { ...state, ...setAside };
    case 'source-refused':
      return { ...state, sourceError: action.message, requestError: null, result: null };
    case 'sent':
      return {
        ...state,
        sourceError: null,
        requestError: null,
        result: null,
        sending: { step: action.step, progress: { phase: 'uploading', loadedBytes: 0, totalBytes: action.totalBytes } },
      };
    case 'progressed':
      return state.sending ? { ...state, sending: { ...state.sending, progress: action.progress } } : state;
    case 'checked':
      return { ...state, checked: action.checked };
    case 'imported':
      return {
        ...state,
        result: action.result,
        checked: null,
        file: null,
        pasted: '',
        fileInputKey: state.fileInputKey + 1,
      };
    case 'failed':
      return { ...state, requestError: action.message };
    case 'settled':
      return { ...state, sending: null };
  }
}

/** The CSV the form holds now, or null when there is none yet. */
function sourceOf(state: CatalogImportState): UploadFile | null {
  if (state.mode === 'file') return state.file ? { blob: state.file, fileName: state.file.name } : null;
  if (state.pasted.trim() === '') return null;
  return { blob: new Blob([state.pasted], { type: 'text/csv' }), fileName: 'pasted-catalog.csv' };
}

/** Catalog import's state and moves; the views only draw it. */
export function useCatalogImport() {
  const [state, dispatch] = useReducer(catalogImportReducer, initialCatalogImportState);
  const previewMutation = usePreviewCatalogImport();
  const commitMutation = useCommitCatalogImport();
  const onProgress = (progress: UploadProgress) => dispatch({ type: 'progressed', progress });

  const check = async () => {
    const source = sourceOf(state);
    if (!source) {
      dispatch({
        type: 'source-refused',
        message: state.mode === 'file' ? 'Choose a CSV file.' : 'Paste the CSV text.',
      });
      return;
    }
    if (source.blob.size > catalogImportUploadLimit.maxFileBytes) {
      const name = state.mode === 'file' ? source.fileName : 'The pasted text';
      const message = fileTooLargeMessage(name, source.blob.size, catalogImportUploadLimit);
      dispatch({ type: 'source-refused', message });
      return;
    }
    dispatch({ type: 'sent', step: 'preview', totalBytes: source.blob.size });
    try {
      const preview = await previewMutation.mutateAsync({ source, onProgress });
      dispatch({ type: 'checked', checked: { preview, source } });
    } catch (error) {
      if (!isUploadCancelled(error)) {
        const { fields, message } = describeSubmitError(error);
        dispatch({ type: 'failed', message: fields.csv ?? fields.file ?? message });
      }
    } finally {
      dispatch({ type: 'settled' });
    }
  };

  const commit = async () => {
    const { checked } = state;
    if (!checked) return;
    dispatch({ type: 'sent', step: 'commit', totalBytes: checked.source.blob.size });
    try {
      const result = await commitMutation.mutateAsync({
        source: checked.source,
        checksum: checked.preview.checksum,
        onProgress,
      });
      dispatch({ type: 'imported', result });
    } catch (error) {
      if (!isUploadCancelled(error)) dispatch({ type: 'failed', message: describeSubmitError(error).message });
    } finally {
      dispatch({ type: 'settled' });
    }
  };

  /** Opens the chosen file in the text box, to fix rows there and check again. */
  const editFileAsText = async () => {
    if (!state.file) return;
    const text = await state.file.text();
    dispatch({ type: 'text-edited', text: text.replace(/^\uFEFF/, ''), mode: 'paste' });
  };

  return {
    ...state,
    setMode: (mode: CsvSourceMode) => dispatch({ type: 'mode-chosen', mode }),
    chooseFile: (file: File | null) => dispatch({ type: 'file-chosen', file }),
    setPasted: (text: string) => dispatch({ type: 'text-edited', text }),
    discard: () => dispatch({ type: 'discarded' }),
    check,
    commit,
    editFileAsText,
  };
}

export type CatalogImportFlow = ReturnType<typeof useCatalogImport>;
