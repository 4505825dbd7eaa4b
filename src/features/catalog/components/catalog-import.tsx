import { useId, useRef, useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonStyles } from '../../../components/ui/button';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { describeSubmitError } from '../../../lib/form-errors';
import { paths } from '../../../lib/paths';
import {
  CATALOG_IMPORT_MAX_BYTES,
  CATALOG_IMPORT_MAX_ROWS,
  catalogCsvColumns,
  type CatalogImportPreview,
  type CatalogImportResult,
} from '../../../../shared/schemas/catalog-import';
import {
  useCommitCatalogImport,
  usePreviewCatalogImport,
  type CsvSource,
  type UploadProgress,
} from '../api/import-catalog';
import { ImportErrorTable, ImportRowTable, importCounts } from './import-preview';
import { TextArea } from '../../../components/ui/text-area';
import { UploadProgressBar } from './upload-progress-bar';

type Mode = 'file' | 'paste';
interface Checked {
  preview: CatalogImportPreview;
  /** Exactly what was previewed; the commit sends the same bytes with the preview's checksum. */
  source: CsvSource;
}

const templateHref = `data:text/csv;charset=utf-8,${encodeURIComponent(
  `${catalogCsvColumns.map((column) => column.name).join(',')}\r\n`,
)}`;

const plural = (count: number, one: string, many: string) => `${count} ${count === 1 ? one : many}`;

/** Import in two steps: check the file (nothing is saved), then confirm to save every row at once, or none. */
export function CatalogImport() {
  const [mode, setMode] = useState<Mode>('file');
  const [file, setFile] = useState<File | null>(null);
  const [fileInputKey, setFileInputKey] = useState(0);
  const [pasted, setPasted] = useState('');
  const [sourceError, setSourceError] = useState<string | undefined>();
  const [checked, setChecked] = useState<Checked | null>(null);
  const [progress, setProgress] = useState<{ step: 'preview' | 'commit'; value: UploadProgress } | null>(null);
  const [requestError, setRequestError] = useState<string | null>(null);
  const [result, setResult] = useState<CatalogImportResult | null>(null);
  const previewMutation = usePreviewCatalogImport();
  const commitMutation = useCommitCatalogImport();
  const fileInputId = useId();
  const fileHintId = useId();
  const fileErrorId = useId();
  const previewHeadingRef = useRef<HTMLHeadingElement>(null);
  const resultRef = useRef<HTMLDivElement>(null);
  const busy = progress !== null;

  // A preview belongs to the exact text it checked: any change to the input sets it aside.
  const inputChanged = () => {
    setChecked(null);
    setRequestError(null);
    setSourceError(undefined);
    setResult(null);
  };

  const currentSource = (): CsvSource | null => {
    if (mode === 'file') return file ? { blob: file, fileName: file.name } : null;
    if (pasted.trim() === '') return null;
    return { blob: new Blob([pasted], { type: 'text/csv' }), fileName: 'pasted-catalog.csv' };
  };

  const check = async (event: FormEvent) => {
    event.preventDefault();
    setRequestError(null);
    setResult(null);
    const source = currentSource();
    if (!source) {
      setSourceError(mode === 'file' ? 'Choose a CSV file.' : 'Paste the CSV text.');
      return;
    }
    if (source.blob.size > CATALOG_IMPORT_MAX_BYTES) {
      setSourceError(
        `The file is ${Math.round(source.blob.size / 1000)} kB; one import takes at most ${Math.round(CATALOG_IMPORT_MAX_BYTES / 1000)} kB. Split it into parts.`,
      );
      return;
    }
    setSourceError(undefined);
    setProgress({ step: 'preview', value: { phase: 'uploading', loadedBytes: 0, totalBytes: source.blob.size } });
    try {
      const preview = await previewMutation.mutateAsync({
        source,
        onProgress: (value) => setProgress({ step: 'preview', value }),
      });
      setChecked({ preview, source });
      requestAnimationFrame(() => previewHeadingRef.current?.focus());
    } catch (error) {
      const { fields, message } = describeSubmitError(error);
      setRequestError(fields.csv ?? message);
    } finally {
      setProgress(null);
    }
  };

  const commit = async () => {
    if (!checked) return;
    setRequestError(null);
    setProgress({
      step: 'commit',
      value: { phase: 'uploading', loadedBytes: 0, totalBytes: checked.source.blob.size },
    });
    try {
      const outcome = await commitMutation.mutateAsync({
        source: checked.source,
        checksum: checked.preview.checksum,
        onProgress: (value) => setProgress({ step: 'commit', value }),
      });
      setResult(outcome);
      setChecked(null);
      setFile(null);
      setPasted('');
      setFileInputKey((key) => key + 1);
      requestAnimationFrame(() => resultRef.current?.focus());
    } catch (error) {
      setRequestError(describeSubmitError(error).message);
    } finally {
      setProgress(null);
    }
  };

  const editFileAsText = async () => {
    if (!file) return;
    const text = await file.text();
    setPasted(text.replace(/^\uFEFF/, ''));
    setMode('paste');
    inputChanged();
  };

  const preview = checked?.preview;
  const counts = preview ? importCounts(preview) : null;

  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link to={paths.catalog} className="text-muted underline underline-offset-2 hover:text-ink">
          Catalog
        </Link>
        <span aria-hidden="true" className="mx-1.5 text-muted">
          /
        </span>
        <span aria-current="page">Import</span>
      </nav>
      <PageHeader
        title="Import products from CSV"
        description={`One product per row, header row first, UTF-8. A row whose maker and model are already in the catalog updates that product; price columns add to its price history. Up to ${CATALOG_IMPORT_MAX_ROWS} rows per file.`}
      />

      {result && (
        <div ref={resultRef} tabIndex={-1} className="mb-5 outline-none">
          <Alert tone="success" announce title="Imported">
            {plural(result.created, 'product', 'products')} added, {result.updated} updated, {result.unchanged}{' '}
            unchanged, {plural(result.pricesAdded, 'price', 'prices')} added to the history.{' '}
            <Link to={paths.catalog} className="font-medium underline underline-offset-2">
              Open the catalog
            </Link>
          </Alert>
        </div>
      )}

      <div className="grid grid-cols-1 gap-5 lg:grid-cols-[3fr_2fr]">
        <Panel title="1 · Choose the file" description="Checking saves nothing; you see every row first.">
          <form noValidate onSubmit={check} className="space-y-4">
            <fieldset>
              <legend className="mb-1.5 text-sm font-semibold text-ink">Where the CSV comes from</legend>
              <div className="flex flex-wrap gap-x-5 gap-y-1.5 text-sm">
                {(
                  [
                    ['file', 'A file'],
                    ['paste', 'Pasted text'],
                  ] as const
                ).map(([value, label]) => (
                  <label key={value} className="inline-flex items-center gap-2">
                    <input
                      type="radio"
                      name="csv-source"
                      value={value}
                      checked={mode === value}
                      onChange={() => {
                        setMode(value);
                        inputChanged();
                      }}
                      className="size-4 accent-copper"
                    />
                    {label}
                  </label>
                ))}
              </div>
            </fieldset>

            <div hidden={mode !== 'file'}>
              <label htmlFor={fileInputId} className="mb-1 block text-sm font-semibold text-ink">
                CSV file
              </label>
              <input
                key={fileInputKey}
                id={fileInputId}
                type="file"
                accept=".csv,text/csv"
                aria-invalid={sourceError ? true : undefined}
                aria-describedby={[sourceError ? fileErrorId : '', fileHintId].filter(Boolean).join(' ')}
                onChange={(event) => {
                  setFile(event.target.files?.[0] ?? null);
                  inputChanged();
                }}
                className="block w-full text-sm file:mr-3 file:min-h-9 file:rounded-[3px] file:border file:border-edge file:bg-surface file:px-3.5 file:font-medium file:text-ink hover:file:bg-wash"
              />
              {sourceError && (
                <p id={fileErrorId} className="mt-1 flex gap-1.5 text-sm font-medium text-red">
                  <span aria-hidden="true">✕</span>
                  <span>{sourceError}</span>
                </p>
              )}
              <p id={fileHintId} className="mt-1 text-[0.8125rem] text-muted">
                {file ? `${file.name}, ${Math.max(1, Math.round(file.size / 1000))} kB.` : 'Nothing chosen yet.'} An
                exported catalog file imports back as it is.
              </p>
            </div>
            {mode === 'paste' && (
              <TextArea
                label="CSV text"
                rows={8}
                value={pasted}
                error={sourceError}
                spellCheck={false}
                textAreaClassName="font-mono text-[0.8125rem] whitespace-pre"
                description="Paste the rows with the header row first. You can fix rows here and check again."
                onChange={(event) => {
                  setPasted(event.target.value);
                  inputChanged();
                }}
              />
            )}

            <div className="flex flex-wrap items-center gap-3">
              <Button type="submit" variant="primary" pending={progress?.step === 'preview'} disabled={busy}>
                Check the file
              </Button>
              {mode === 'file' && file && (
                <Button onClick={() => void editFileAsText()} disabled={busy}>
                  Edit it as text here
                </Button>
              )}
            </div>
            {progress?.step === 'preview' && (
              <UploadProgressBar
                progress={progress.value}
                label="Checking the file"
                processingText="Uploaded. Checking every row against the catalog…"
              />
            )}
          </form>
        </Panel>

        <Panel title="Columns" description="Only the first six are required; unknown columns are ignored.">
          <details className="text-sm">
            <summary className="cursor-pointer font-medium text-ink">
              Show all {catalogCsvColumns.length} columns
            </summary>
            <dl className="mt-2 space-y-1">
              {catalogCsvColumns.map((column) => (
                <div key={column.name} className="grid grid-cols-[minmax(9rem,auto)_1fr] gap-2">
                  <dt className="font-mono text-[0.8125rem]">
                    {column.name}
                    {column.required && <span className="ml-1 font-sans text-xs text-copper">required</span>}
                  </dt>
                  <dd className="text-muted">{column.help}</dd>
                </div>
              ))}
            </dl>
          </details>
          <a
            href={templateHref}
            download="benchwire-catalog-template.csv"
            className={buttonStyles('secondary', 'sm', 'mt-3')}
          >
            Download an empty template
          </a>
        </Panel>
      </div>

      {requestError && (
        <Alert tone="danger" announce className="mt-5" title="Nothing was imported">
          {requestError}
        </Alert>
      )}

      {preview && counts && (
        <section aria-labelledby="import-preview-heading" className="mt-6 space-y-4">
          <h2
            id="import-preview-heading"
            ref={previewHeadingRef}
            tabIndex={-1}
            className="text-lg font-semibold text-ink outline-none"
          >
            2 · Check what the file would do
          </h2>
          <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
            <Figure term="Rows" value={preview.rowCount} />
            <Figure term="Rows without problems" value={preview.validRowCount} />
            <Figure term="New products" value={counts.creates} />
            <Figure term="Updated products" value={counts.updates} />
            <Figure term="Prices to add" value={counts.pricesAdded} />
            <Figure term="Problems" value={preview.errors.length} alert={preview.errors.length > 0} />
          </dl>
          {preview.ignoredColumns.length > 0 && (
            <Alert tone="info">
              These columns are not catalog columns and will be ignored:{' '}
              <span className="font-mono">{preview.ignoredColumns.join(', ')}</span>.
            </Alert>
          )}

          {preview.errors.length > 0 ? (
            <>
              <Alert tone="danger" announce title="Nothing has been saved">
                {plural(preview.errors.length, 'problem', 'problems')} in {plural(counts.rowsWithErrors, 'row', 'rows')}
                . The import saves every row or none, so fix or remove these rows, then check the file again.
              </Alert>
              <ImportErrorTable preview={preview} />
            </>
          ) : (
            <Panel
              title="3 · Confirm the import"
              description="Every row is saved in one go; if anything fails, nothing is."
            >
              <p className="text-sm text-ink">
                {plural(counts.creates, 'new product', 'new products')}, {plural(counts.updates, 'update', 'updates')}
                {counts.unchanged > 0 ? `, ${counts.unchanged} unchanged` : ''} and{' '}
                {plural(counts.pricesAdded, 'price', 'prices')} for the history.
              </p>
              <div className="mt-3 flex flex-wrap items-center gap-3">
                <Button
                  variant="primary"
                  onClick={() => void commit()}
                  pending={progress?.step === 'commit'}
                  disabled={busy}
                >
                  Confirm import of {plural(preview.validRowCount, 'row', 'rows')}
                </Button>
                <Button variant="quiet" onClick={inputChanged} disabled={busy}>
                  Discard this check
                </Button>
              </div>
              {progress?.step === 'commit' && (
                <div className="mt-3">
                  <UploadProgressBar
                    progress={progress.value}
                    label="Importing"
                    processingText="Uploaded. Saving every row in one transaction…"
                  />
                </div>
              )}
            </Panel>
          )}

          <h3 className="text-base font-semibold text-ink">Rows in the file</h3>
          <ImportRowTable preview={preview} />
        </section>
      )}
    </>
  );
}

function Figure({ term, value, alert = false }: { term: string; value: number; alert?: boolean }) {
  return (
    <div className={`rounded-[3px] border bg-surface px-3 py-2 ${alert ? 'border-red' : 'border-rule'}`}>
      <dt className="text-xs text-muted">{term}</dt>
      <dd className={`numeric text-lg ${alert ? 'text-red' : 'text-ink'}`}>{value}</dd>
    </div>
  );
}
