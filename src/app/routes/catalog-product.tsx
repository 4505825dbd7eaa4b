import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { productQueryOptions } from '../../features/catalog/api/get-product';
import { ProductDetailView } from '../../features/catalog/components/product-detail';
import { productIdFrom } from '../../features/catalog/components/product-id';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import { catalogEditors, planEditors, may } from '../../../shared/access/roles';

export function loader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const id = productIdFrom(params.productId);
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (user && canOpen(paths.catalog, user.role)) await queryClient.ensureQueryData(productQueryOptions(id));
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.catalog} pageName="Catalog">
      <ProductPage />
    </RoleGate>
  );
}

function ProductPage() {
  const user = useSession();
  const id = productIdFrom(useParams().productId);
  if (!user) return null;
  return (
    // Keyed by product, so moving to another product starts its forms afresh.
    <ProductDetailView
      key={id}
      productId={id}
      canEdit={may(user.role, catalogEditors)}
      canDelete={may(user.role, planEditors)}
    />
  );
}
