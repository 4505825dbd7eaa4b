import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { productsQueryOptions } from '../../features/catalog/api/get-products';
import { CatalogBrowser } from '../../features/catalog/components/catalog-browser';
import { filtersFromSearchParams } from '../../features/catalog/components/catalog-search-params';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import { catalogEditors, may } from '../../../shared/access/roles';

export function loader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (user && canOpen(paths.catalog, user.role)) {
      const filters = filtersFromSearchParams(new URL(request.url).searchParams);
      await queryClient.ensureQueryData(productsQueryOptions(filters));
    }
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.catalog} pageName="Catalog">
      <CatalogPage />
    </RoleGate>
  );
}

function CatalogPage() {
  const user = useSession();
  if (!user) return null;
  return <CatalogBrowser canEdit={may(user.role, catalogEditors)} />;
}
