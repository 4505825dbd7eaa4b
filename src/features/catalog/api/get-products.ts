import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import {
  productListSchema,
  type FormFactor,
  type ProductList,
  type ProductListQuery,
  type VcoreStageType,
} from '../../../../shared/schemas/catalog';
import { catalogKeys } from './catalog-keys';

/** The filters the catalog page keeps in its address, as the list endpoint takes them. */
export interface ProductFilters {
  search?: string;
  maker?: string;
  platform?: string;
  chipset?: string;
  formFactor?: FormFactor;
  vcoreStageType?: VcoreStageType;
  archived: NonNullable<ProductListQuery['archived']>;
}

/** Most rows one page of the catalog shows; the server allows 500. */
export const CATALOG_PAGE_SIZE = 500;

function toSearchParams(filters: ProductFilters): URLSearchParams {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  params.set('limit', String(CATALOG_PAGE_SIZE));
  return params;
}

export function getProducts(filters: ProductFilters, signal?: AbortSignal): Promise<ProductList> {
  return apiClient.get(`/api/catalog/products?${toSearchParams(filters)}`, { signal, schema: productListSchema });
}

export function productsQueryOptions(filters: ProductFilters) {
  return queryOptions({
    queryKey: catalogKeys.list({ ...filters }),
    queryFn: ({ signal }) => getProducts(filters, signal),
  });
}

export function useProducts(filters: ProductFilters) {
  return useSuspenseQuery(productsQueryOptions(filters)).data;
}
