import { Badge } from '../../../components/ui/badge';
import type { CatalogImportPreview, ImportRowPreview } from '../../../../shared/schemas/catalog-import';
import { formatPrice } from '../../../lib/format-money';
import { formatCalendarDate } from '../../../lib/format-time';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';

const th = 'px-3 py-1.5 text-xs font-semibold tracking-wide whitespace-nowrap text-muted uppercase';
const td = 'px-3 py-1.5 align-top';

/** Every problem the server found, one line each: row number (the header is row 1), column, message. */
export function ImportErrorTable({ preview }: { preview: CatalogImportPreview }) {
  return (
    <div
      role="region"
      aria-label="Problems found in the file"
      tabIndex={0}
      className="overflow-x-auto rounded-[3px] border border-rule border-l-4 border-l-red bg-surface"
    >
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Problems found in the file, by row and column</caption>
        <thead>
          <tr className="border-b border-edge/70 bg-wash">
            <th scope="col" className={`${th} text-right`}>
              Row
            </th>
            <th scope="col" className={`${th} text-left`}>
              Column
            </th>
            <th scope="col" className={`${th} text-left`}>
              Problem
            </th>
          </tr>
        </thead>
        <tbody>
          {preview.errors.map((error, index) => (
            <tr key={`${error.rowNumber}-${error.column}-${index}`} className="border-b border-rule last:border-b-0">
              <td className={`${td} numeric text-right`}>{error.rowNumber}</td>
              <td className={`${td} font-mono text-[0.8125rem] whitespace-nowrap`}>
                {error.column ?? <span className="font-sans text-muted">whole row</span>}
              </td>
              <td className={td}>{error.message}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
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
    <div
      role="region"
      aria-label="Rows in the file"
      tabIndex={0}
      className="overflow-x-auto rounded-[3px] border border-rule bg-surface"
    >
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">What each row of the file would do</caption>
        <thead>
          <tr className="border-b border-edge/70 bg-wash">
            <th scope="col" className={`${th} text-right`}>
              Row
            </th>
            <th scope="col" className={`${th} text-left`}>
              Product
            </th>
            <th scope="col" className={`${th} text-left`}>
              Outcome
            </th>
            <th scope="col" className={`${th} text-left`}>
              Changes
            </th>
            <th scope="col" className={`${th} text-left`}>
              Price
            </th>
          </tr>
        </thead>
        <tbody>
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
        </tbody>
      </table>
    </div>
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
