import { productDisplayName } from '../../shared/domain/planning/product-display-name';

/** A product as planning screens name it: maker, then model, the maker written once. */
export const productName = productDisplayName;
