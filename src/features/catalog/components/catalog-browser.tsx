import { useMemo } from 'react';
import { Link, useLocation, useSearchParams } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { buttonStyles } from '../../../components/ui/button';
import { DataTable } from '../../../components/ui/data-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { userTimeZone } from '../../../lib/format-time';
import { paths } from '../../../lib/paths';
import type { Product } from '../../../../shared/schemas/catalog';
import { CATALOG_PAGE_SIZE, useProducts } from '../api/get-products';
import { catalogColumns } from './catalog-columns';
import { CatalogFilters } from './catalog-filters';
import { filtersFromSearchParams, hasActiveFilters } from './catalog-search-params';
import { ExportMenu } from './export-menu';

export interface CatalogBrowserProps {
  /** Editors and bench testers add, edit and import; writers read. */
  canEdit: boolean;
}

/** The catalog page: search and filters in the address, a sortable table with a remembered column choice. */
export function CatalogBrowser({ canEdit }: CatalogBrowserProps) {
  const [params] = useSearchParams();
  const location = useLocation();
  const filters = useMemo(() => filtersFromSearchParams(params), [params]);
  const list = useProducts(filters);
  const notice = (location.state as { notice?: string } | null)?.notice;

  const columns = useMemo(
    () => catalogColumns({ regions: list.facets.regions, canEdit }),
    [list.facets.regions, canEdit],
  );
  const filtered = hasActiveFilters(params);
  const catalogIsEmpty = list.total === 0 && !filtered;

  return (
    <>
      <PageHeader
        eyebrow="Roundup planning"
        title="Catalog"
        description="Every board the outlet tracks: power design, features and the latest price seen in each region."
        actions={
          <>
            {canEdit && (
              <>
                <Link to={paths.catalogNew} className={buttonStyles('primary')}>
                  New product
                </Link>
                <Link to={paths.catalogImport} className={buttonStyles('secondary')}>
                  Import CSV
                </Link>
              </>
            )}
            <ExportMenu regions={list.facets.regions} archived={filters.archived} platform={filters.platform} />
          </>
        }
      />
      {notice && (
        <Alert tone="success" announce className="mb-4">
          {notice}
        </Alert>
      )}

      {catalogIsEmpty ? (
        <EmptyState
          title="The catalog is empty"
          action={
            canEdit ? (
              <Link to={paths.catalogImport} className={buttonStyles('primary')}>
                Import a CSV
              </Link>
            ) : undefined
          }
        >
          {canEdit
            ? 'Add boards one by one with New product, or bring a whole list in with a CSV import.'
            : 'Editors and bench testers add the boards; they will show up here.'}
        </EmptyState>
      ) : (
        <>
          <CatalogFilters facets={list.facets} />
          {list.total > list.products.length && (
            <Alert tone="info" className="mb-3">
              Showing the first {list.products.length} of {list.total} products (at most {CATALOG_PAGE_SIZE} at a time).
              Narrow the search or filters to see the rest.
            </Alert>
          )}
          <DataTable<Product>
            caption="Catalog products"
            rows={list.products}
            columns={columns}
            initialSort={{ columnId: 'maker', direction: 'ascending' }}
            noun={['product', 'products']}
            columnChoice={{ storageKey: 'benchwire:catalog:columns' }}
            empty={
              <EmptyState title="No products match">
                Nothing in the catalog matches this search and these filters. Clear them to see every product.
              </EmptyState>
            }
            rowClassName={(product) => (product.archived ? 'text-muted' : undefined)}
            footnote={
              <>
                Prices are the latest seen in each region, in the currency they were seen in; each product's page has
                the full history with dates and sources. Times are in{' '}
                <strong className="font-medium">{userTimeZone()}</strong>.
              </>
            }
          />
        </>
      )}
    </>
  );
}
