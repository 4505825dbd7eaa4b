import type { QueryClient } from '@tanstack/react-query';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { productQueryOptions, useProduct } from '../../features/catalog/api/get-product';
import { useUpdateProduct } from '../../features/catalog/api/save-product';
import { ProductForm } from '../../features/catalog/components/product-form';
import { productFormValuesFrom } from '../../features/catalog/components/product-form-values';
import { productIdFrom } from '../../features/catalog/components/product-id';
import { PageHeader } from '../../components/ui/page-header';
import { ForbiddenState } from '../../components/ui/forbidden-state';
import { roleLabels } from '../../../shared/schemas/common';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import { productDisplayName } from '../../../shared/domain/planning/product-display-name';
import { catalogEditors, may } from '../../../shared/access/roles';

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
      <EditProductPage />
    </RoleGate>
  );
}

function EditProductPage() {
  const user = useSession();
  const id = productIdFrom(useParams().productId);
  if (!user) return null;
  if (!may(user.role, catalogEditors))
    return <ForbiddenState pageName="Edit product" roleLabel={roleLabels[user.role]} />;
  return <EditProduct key={id} id={id} />;
}

function EditProduct({ id }: { id: number }) {
  const product = useProduct(id);
  const updateProduct = useUpdateProduct();
  const navigate = useNavigate();
  return (
    <>
      <PageHeader
        eyebrow="Catalog"
        title={`Edit ${productDisplayName(product)}`}
        description="Changes show in the catalog and in every roundup plan that lists this board."
      />
      <ProductForm
        initialValues={productFormValuesFrom(product)}
        submitLabel="Save changes"
        errorTitle="The changes were not saved"
        cancelTo={paths.catalogProduct(id)}
        save={(input) => updateProduct.mutateAsync({ id, changes: input })}
        onSaved={(saved) => navigate(paths.catalogProduct(saved.id), { state: { notice: 'Saved.' } })}
      />
    </>
  );
}
