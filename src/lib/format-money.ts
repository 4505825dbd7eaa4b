import { formatMoney } from '../../shared/domain/planning/money';

/** A price or cost as the reader's eye expects it, e.g. "€189.99"; the currency always shows. */
export function formatPrice(price: { amountMinor: number; currency: string }): string {
  return formatMoney(price.amountMinor, price.currency);
}
