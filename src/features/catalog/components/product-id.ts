import { addressId } from '../../../lib/address-id';

/** The product id from the address; anything that is not a positive whole number is "not found". */
export const productIdFrom = (value: string | undefined) => addressId(value, 'That product was not found.');
