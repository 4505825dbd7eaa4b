import { Link } from 'react-router';
import { paths } from '../../../lib/paths';

/** Catalog / <this page>: the way back to the catalog list from a page below it. */
export function CatalogBreadcrumb({ current }: { current: string }) {
  return (
    <nav aria-label="Breadcrumb" className="mb-2 text-sm">
      <Link to={paths.catalog} className="text-muted underline underline-offset-2 hover:text-ink">
        Catalog
      </Link>
      <span aria-hidden="true" className="mx-1.5 text-muted">
        /
      </span>
      <span aria-current="page">{current}</span>
    </nav>
  );
}
