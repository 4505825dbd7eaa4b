import type { Ref } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { UploadProgress } from '../../../components/ui/upload-progress';
import type { CatalogImportPreview } from '../../../../shared/schemas/catalog-import';
import { ImportErrorTable, ImportRowTable, importCounts } from './import-preview';
import type { CatalogImportFlow } from './use-catalog-import';

export const plural = (count: number, one: string, many: string) => `${count} ${count === 1 ? one : many}`;

function Figure({ term, value, alert = false }: { term: string; value: number; alert?: boolean }) {
  return (
    <div className={`rounded-[3px] border bg-surface px-3 py-2 ${alert ? 'border-red' : 'border-rule'}`}>
      <dt className="text-xs text-muted">{term}</dt>
      <dd className={`numeric text-lg ${alert ? 'text-red' : 'text-ink'}`}>{value}</dd>
    </div>
  );
}

export interface CatalogImportCheckProps {
  flow: CatalogImportFlow;
  preview: CatalogImportPreview;
  headingRef: Ref<HTMLHeadingElement>;
}

/** Steps 2 and 3: what the file would do, its problems by row and column, and the confirmation when there are none. */
export function CatalogImportCheck({ flow, preview, headingRef }: CatalogImportCheckProps) {
  const counts = importCounts(preview);
  const { sending } = flow;
  const busy = sending !== null;

  return (
    <section aria-labelledby="import-preview-heading" className="mt-6 space-y-4">
      <h2
        id="import-preview-heading"
        ref={headingRef}
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
            {plural(preview.errors.length, 'problem', 'problems')} in {plural(counts.rowsWithErrors, 'row', 'rows')}.
            The import saves every row or none, so fix or remove these rows, then check the file again.
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
              onClick={() => void flow.commit()}
              pending={sending?.step === 'commit'}
              disabled={busy}
            >
              Confirm import of {plural(preview.validRowCount, 'row', 'rows')}
            </Button>
            <Button variant="quiet" onClick={flow.discard} disabled={busy}>
              Discard this check
            </Button>
          </div>
          {sending?.step === 'commit' && (
            <div className="mt-3">
              <UploadProgress
                progress={sending.progress}
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
  );
}
