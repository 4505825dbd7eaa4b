/**
 * A product as every screen, message and label names it: maker, then model — once. Some makers put their own name
 * at the start of the model name ("Vesk" + "Vesk Halden B70"); the maker is then not written a second time.
 */
export function productDisplayName(product: { maker: string; model: string }): string {
  const maker = product.maker.trim().replace(/\s+/g, ' ');
  const model = product.model.trim().replace(/\s+/g, ' ');
  if (!maker) return model;
  if (!model) return maker;
  const head = model.slice(0, maker.length);
  const next = model.charAt(maker.length);
  const startsWithMaker =
    head.localeCompare(maker, undefined, { sensitivity: 'base' }) === 0 && (next === '' || /[\s\-–·/]/.test(next));
  return startsWithMaker ? model : `${maker} ${model}`;
}
