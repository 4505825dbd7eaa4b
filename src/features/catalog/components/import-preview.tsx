import type { ReactNode } from 'react';
import { Badge } from '../../../components/ui/badge';
import type { CatalogImportPreview, ImportRowPreview } from '../../../../shared/schemas/catalog-import';
import { formatPrice } from '../../../lib/format-money';
import { formatCalendarDate } from '../../../lib/format-time';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';

const th = 'px-3 py-1.5 text-xs font-semibold tracking-wide whitespace-nowrap text-muted uppercase';
const td = 'px-3 py-1.5 align-top';

/** A scrollable table of the preview; the first column (the row number) is right-aligned. */
function PreviewTable({
  label,
  caption,
  columns,
  className = '',
  children,
}: {
  label: string;
  caption: string;
  columns: readonly string[];
  className?: string;
  children: ReactNode;
}) {
  return (
    <div
      role="region"
      aria-label={label}
      tabIndex={0}
      className={`overflow-x-auto rounded-[3px] border border-rule bg-surface ${className}`}
    >
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b border-edge/70 bg-wash">
            {columns.map((column, index) => (
              <th key={column} scope="col" className={`${th} ${index === 0 ? 'text-right' : 'text-left'}`}>
                {column}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}

/** Every problem the server found, one line each: row number (the header is row 1), column, message. */
export function ImportErrorTable({ preview }: { preview: CatalogImportPreview }) {
  return (
    <PreviewTable
      label="Problems found in the file"
      caption="Problems found in the file, by row and column"
      columns={['Row', 'Column', 'Problem']}
      className="border-l-4 border-l-red"
    >
      {preview.errors.map((error, index) => (
        <tr key={`${error.rowNumber}-${error.column}-${index}`} className="border-b border-rule last:border-b-0">
          <td className={`${td} numeric text-right`}>{error.rowNumber}</td>
          <td className={`${td} font-mono text-[0.8125rem] whitespace-nowrap`}>
            {error.column ?? <span className="font-sans text-muted">whole row</span>}
          </td>
          <td className={td}>{error.message}</td>
        </tr>
      ))}
    </PreviewTable>
  );
}

function actionBadge(row: ImportRowPreview) {
  if (row.errors.length > 0)
    return <Badge tone="negative">{row.errors.length === 1 ? '1 problem' : `${row.errors.length} problems`}</Badge>;
  if (row.action === 'create') return <Badge tone="accent">New</Badge>;
  if (row.changedFields.length > 0) return <Badge tone="neutral">Update</Badge>;
  return <Badge tone="muted">No change</Badge>;
}

/** What each row would do: create or update a product, and add a price or skip a duplicate one. */
export function ImportRowTable({ preview }: { preview: CatalogImportPreview }) {
  return (
    <PreviewTable
      label="Rows in the file"
      caption="What each row of the file would do"
      columns={['Row', 'Product', 'Outcome', 'Changes', 'Price']}
    >
      {preview.rows.map((row) => (
        <tr
          key={row.rowNumber}
          className={`border-b border-rule last:border-b-0 ${row.errors.length > 0 ? 'bg-wash/70' : ''}`}
        >
          <td className={`${td} numeric text-right`}>{row.rowNumber}</td>
          <th scope="row" className={`${td} text-left font-medium`}>
            {row.maker || row.model ? (
              productDisplayName(row)
            ) : (
              <span className="font-normal text-muted">No maker or model</span>
            )}
          </th>
          <td className={td}>{actionBadge(row)}</td>
          <td className={`${td} text-[0.8125rem] text-muted`}>
            {row.action === 'update' && row.changedFields.length > 0 ? row.changedFields.join(', ') : '—'}
          </td>
          <td className={`${td} whitespace-nowrap`}>
            {row.price ? (
              <span className="numeric">
                {formatPrice(row.price)} {row.price.region}, {formatCalendarDate(row.price.observedOn)}
                {row.price.action === 'duplicate' && (
                  <span className="ml-1 font-sans text-muted">(already recorded)</span>
                )}
              </span>
            ) : (
              <span className="text-muted">—</span>
            )}
          </td>
        </tr>
      ))}
    </PreviewTable>
  );
}

export function importCounts(preview: CatalogImportPreview) {
  const valid = preview.rows.filter((row) => row.errors.length === 0);
  return {
    creates: valid.filter((row) => row.action === 'create').length,
    updates: valid.filter((row) => row.action === 'update' && row.changedFields.length > 0).length,
    unchanged: valid.filter((row) => row.action === 'update' && row.changedFields.length === 0).length,
    pricesAdded: valid.filter((row) => row.price?.action === 'add').length,
    rowsWithErrors: new Set(preview.errors.map((error) => error.rowNumber)).size,
  };
}
