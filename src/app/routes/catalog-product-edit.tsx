import { useNavigate, useParams } from 'react-router';
import { paths } from '../../lib/paths';
import { productQueryOptions, useProduct } from '../../features/catalog/api/get-product';
import { useUpdateProduct } from '../../features/catalog/api/save-product';
import { ProductForm } from '../../features/catalog/components/product-form';
import { productFormValuesFrom } from '../../features/catalog/components/product-form-values';
import { productIdFrom } from '../../features/catalog/components/product-id';
import { PageHeader } from '../../components/ui/page-header';
import { productDisplayName } from '../../../shared/domain/planning/product-display-name';
import { catalogEditors } from '../../../shared/access/roles';

import { gatedPage, pageLoader } from '../page-route';
export const loader = pageLoader(paths.catalog, (queryClient, { params }) =>
  queryClient.ensureQueryData(productQueryOptions(productIdFrom(params.productId))),
);

export const Component = gatedPage(
  { path: paths.catalog, pageName: 'Edit product', rule: catalogEditors },
  EditProductPage,
);

function EditProductPage() {
  const id = productIdFrom(useParams().productId);
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
