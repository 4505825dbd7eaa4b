/** A product as planning screens name it: maker, then model. */
export function productName(product: { maker: string; model: string }): string {
  return `${product.maker} ${product.model}`;
}
