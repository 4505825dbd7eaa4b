import { paths } from '../../lib/paths';
import { productsQueryOptions } from '../../features/catalog/api/get-products';
import { CatalogBrowser } from '../../features/catalog/components/catalog-browser';
import { filtersFromSearchParams } from '../../features/catalog/components/catalog-search-params';
import { catalogEditors, may } from '../../../shared/access/roles';

import { gatedPage, pageLoader } from '../page-route';
export const loader = pageLoader(paths.catalog, (queryClient, { request }) =>
  queryClient.ensureQueryData(productsQueryOptions(filtersFromSearchParams(new URL(request.url).searchParams))),
);

export const Component = gatedPage({ path: paths.catalog, pageName: 'Catalog' }, ({ user }) => (
  <CatalogBrowser canEdit={may(user.role, catalogEditors)} />
));
