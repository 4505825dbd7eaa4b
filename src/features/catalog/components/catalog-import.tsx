import { useEffect, useRef } from 'react';
import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { buttonStyles } from '../../../components/ui/button';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { paths } from '../../../lib/paths';
import { CATALOG_IMPORT_MAX_ROWS, catalogCsvColumns } from '../../../../shared/schemas/catalog-import';
import { CatalogImportCheck, plural } from './catalog-import-check';
import { CatalogImportSourceForm } from './catalog-import-source-form';
import { useCatalogImport } from './use-catalog-import';
import { CatalogBreadcrumb } from './catalog-breadcrumb';

const templateHref = `data:text/csv;charset=utf-8,${encodeURIComponent(
  `${catalogCsvColumns.map((column) => column.name).join(',')}\r\n`,
)}`;

/** Import in two steps: check the file (nothing is saved), then confirm to save every row at once, or none. */
export function CatalogImport() {
  const flow = useCatalogImport();
  const { checked, result, requestError } = flow;
  const previewHeadingRef = useRef<HTMLHeadingElement>(null);
  const resultRef = useRef<HTMLDivElement>(null);

  // Focus follows each step, so keyboard and screen-reader users land on what just appeared.
  useEffect(() => {
    if (checked) previewHeadingRef.current?.focus();
  }, [checked]);
  useEffect(() => {
    if (result) resultRef.current?.focus();
  }, [result]);

  return (
    <>
      <CatalogBreadcrumb current="Import" />
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
        <CatalogImportSourceForm flow={flow} />

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

      {checked && <CatalogImportCheck flow={flow} preview={checked.preview} headingRef={previewHeadingRef} />}
    </>
  );
}
