import type { QueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { useCreateProduct } from '../../features/catalog/api/save-product';
import { ProductForm } from '../../features/catalog/components/product-form';
import { emptyProductForm } from '../../features/catalog/components/product-form-values';
import { PageHeader } from '../../components/ui/page-header';
import { ForbiddenState } from '../../components/ui/forbidden-state';
import { roleLabels } from '../../../shared/schemas/common';
import { RoleGate } from '../role-gate';
import { productDisplayName } from '../../../shared/domain/planning/product-display-name';
import { catalogEditors, may } from '../../../shared/access/roles';

export function loader(queryClient: QueryClient) {
  return async () => {
    await queryClient.ensureQueryData(sessionQueryOptions());
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.catalog} pageName="Catalog">
      <NewProductPage />
    </RoleGate>
  );
}

function NewProductPage() {
  const user = useSession();
  const createProduct = useCreateProduct();
  const navigate = useNavigate();
  if (!user) return null;
  if (!may(user.role, catalogEditors))
    return <ForbiddenState pageName="New product" roleLabel={roleLabels[user.role]} />;
  return (
    <>
      <PageHeader
        eyebrow="Catalog"
        title="New product"
        description="Maker, model, platform, socket, chipset and form factor are needed; fill in the rest as far as it is known."
      />
      <ProductForm
        initialValues={emptyProductForm}
        submitLabel="Add to catalog"
        errorTitle="The product was not added"
        cancelTo={paths.catalog}
        save={(input) => createProduct.mutateAsync(input)}
        onSaved={(product) =>
          navigate(paths.catalogProduct(product.id), {
            state: { notice: `${productDisplayName(product)} is in the catalog.` },
          })
        }
      />
    </>
  );
}
