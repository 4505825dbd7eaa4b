import { useNavigate } from 'react-router';
import { paths } from '../../lib/paths';
import { useCreateProduct } from '../../features/catalog/api/save-product';
import { ProductForm } from '../../features/catalog/components/product-form';
import { emptyProductForm } from '../../features/catalog/components/product-form-values';
import { PageHeader } from '../../components/ui/page-header';
import { gatedPage, pageLoader } from '../page-route';
import { productDisplayName } from '../../../shared/domain/planning/product-display-name';
import { catalogEditors } from '../../../shared/access/roles';

export const loader = pageLoader(paths.catalog);

export const Component = gatedPage(
  { path: paths.catalog, pageName: 'New product', rule: catalogEditors },
  NewProductPage,
);

function NewProductPage() {
  const createProduct = useCreateProduct();
  const navigate = useNavigate();
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
