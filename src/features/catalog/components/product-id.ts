/** The product id from the address; anything that is not a positive whole number is "not found". */
export function productIdFrom(value: string | undefined): number {
  const id = Number(value);
  if (!Number.isSafeInteger(id) || id <= 0) throw new Response('That product was not found.', { status: 404 });
  return id;
}
