import { paths } from '../../lib/paths';
import { CatalogImport } from '../../features/catalog/components/catalog-import';
import { gatedPage, pageLoader } from '../page-route';
import { catalogEditors } from '../../../shared/access/roles';

export const loader = pageLoader(paths.catalog);

export const Component = gatedPage({ path: paths.catalog, pageName: 'Catalog import', rule: catalogEditors }, () => (
  <CatalogImport />
));
