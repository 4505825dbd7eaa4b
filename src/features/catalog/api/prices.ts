import { apiClient } from '../../../lib/api-client';
import { priceSchema, type CreatePriceRequest, type Price } from '../../../../shared/schemas/catalog';
import { useChangeMutation } from '../../../lib/stale-after';

export interface AddPriceInput {
  productId: number;
  price: CreatePriceRequest;
}

export function addPrice({ productId, price }: AddPriceInput): Promise<Price> {
  return apiClient.post(`/api/catalog/products/${productId}/prices`, price, { schema: priceSchema });
}

export function removePrice({ productId, priceId }: { productId: number; priceId: number }): Promise<void> {
  return apiClient.delete(`/api/catalog/products/${productId}/prices/${priceId}`);
}

/** A price changes the product's history and the latest price the list shows: refresh the whole catalog. */
export function useAddPrice() {
  return useChangeMutation(addPrice, 'product');
}

export function useRemovePrice() {
  return useChangeMutation(removePrice, 'product');
}
