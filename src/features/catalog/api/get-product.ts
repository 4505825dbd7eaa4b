import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { productDetailSchema, type ProductDetail } from '../../../../shared/schemas/catalog';
import { catalogKeys } from './catalog-keys';

export function getProduct(id: number, signal?: AbortSignal): Promise<ProductDetail> {
  return apiClient.get(`/api/catalog/products/${id}`, { signal, schema: productDetailSchema });
}

export function productQueryOptions(id: number) {
  return queryOptions({ queryKey: catalogKeys.detail(id), queryFn: ({ signal }) => getProduct(id, signal) });
}

export function useProduct(id: number) {
  return useSuspenseQuery(productQueryOptions(id)).data;
}
