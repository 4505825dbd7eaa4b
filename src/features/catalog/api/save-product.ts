import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import {
  productDetailSchema,
  type CreateProductRequest,
  type ProductDetail,
  type UpdateProductRequest,
} from '../../../../shared/schemas/catalog';
import { createRecord, editRecord } from '../../../lib/record-requests';
import { catalogKeys } from './catalog-keys';
import { invalidateAfter } from '../../../lib/stale-after';

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
  return useProductSave(
    createRecord<CreateProductRequest, ProductDetail>('/api/catalog/products', productDetailSchema),
  );
}

/** powerDesign and features are replaced as a whole when sent; `archived` archives or restores. */
export function useUpdateProduct() {
  return useProductSave(editRecord<UpdateProductRequest, ProductDetail>('/api/catalog/products', productDetailSchema));
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
