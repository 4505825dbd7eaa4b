import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { productListSchema, type ProductList } from '../../../../shared/schemas/catalog';
import { roundupKeys } from './roundup-keys';

export interface CatalogSearch {
  search?: string;
  platform?: string;
  priceRegion?: string;
  limit?: number;
}

/** The catalog as a roundup needs it: products to add by hand, and the platforms already in use. */
export function getCatalogProducts(search: CatalogSearch, signal?: AbortSignal): Promise<ProductList> {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(search)) {
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  return apiClient.get(`/api/catalog/products?${params.toString()}`, { signal, schema: productListSchema });
}

export function catalogProductsQueryOptions(search: CatalogSearch) {
  return queryOptions({
    queryKey: [...roundupKeys.item('catalog'), search] as const,
    queryFn: ({ signal }) => getCatalogProducts(search, signal),
  });
}

export function useCatalogProducts(search: CatalogSearch, enabled = true) {
  return useQuery({ ...catalogProductsQueryOptions(search), enabled, placeholderData: keepPreviousData });
}
