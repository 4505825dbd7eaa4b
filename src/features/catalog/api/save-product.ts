import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import {
  productDetailSchema,
  type CreateProductRequest,
  type ProductDetail,
  type UpdateProductRequest,
} from '../../../../shared/schemas/catalog';
import { catalogKeys } from './catalog-keys';
import { invalidateAfter } from '../../../lib/stale-after';

export function createProduct(input: CreateProductRequest): Promise<ProductDetail> {
  return apiClient.post('/api/catalog/products', input, { schema: productDetailSchema });
}

export interface UpdateProductInput {
  id: number;
  /** powerDesign and features are replaced as a whole when sent; `archived` archives or restores. */
  changes: UpdateProductRequest;
}

export function updateProduct({ id, changes }: UpdateProductInput): Promise<ProductDetail> {
  return apiClient.patch(`/api/catalog/products/${id}`, changes, { schema: productDetailSchema });
}

export function deleteProduct(id: number): Promise<void> {
  return apiClient.delete(`/api/catalog/products/${id}`);
}

/** A save that answers with the whole product: it goes straight into the cache, and lists are refetched. */
function useProductSave<Input>(mutationFn: (input: Input) => Promise<ProductDetail>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: (product) => {
      queryClient.setQueryData(catalogKeys.detail(product.id), product);
      return invalidateAfter(queryClient, 'product');
    },
  });
}

export function useCreateProduct() {
  return useProductSave(createProduct);
}

export function useUpdateProduct() {
  return useProductSave(updateProduct);
}

export function useDeleteProduct() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteProduct,
    onSuccess: (_result, id) => {
      queryClient.removeQueries({ queryKey: catalogKeys.detail(id) });
      return invalidateAfter(queryClient, 'product');
    },
  });
}
