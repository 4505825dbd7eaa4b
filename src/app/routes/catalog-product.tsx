import { useParams } from 'react-router';
import { paths } from '../../lib/paths';
import { productQueryOptions } from '../../features/catalog/api/get-product';
import { ProductDetailView } from '../../features/catalog/components/product-detail';
import { productIdFrom } from '../../features/catalog/components/product-id';
import { catalogEditors, planEditors, may } from '../../../shared/access/roles';

import { gatedPage, pageLoader } from '../page-route';
import type { CurrentUser } from '../../../shared/schemas/auth';
export const loader = pageLoader(paths.catalog, (queryClient, { params }) =>
  queryClient.ensureQueryData(productQueryOptions(productIdFrom(params.productId))),
);

export const Component = gatedPage({ path: paths.catalog, pageName: 'Catalog' }, ProductPage);

function ProductPage({ user }: { user: CurrentUser }) {
  const id = productIdFrom(useParams().productId);
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
