/**
 * A record's id from the address (`/roundups/:id`); anything that is not a positive whole number is "not found",
 * which the route's error page shows.
 */
export function addressId(value: string | undefined, notFound = 'Not found'): number {
  const id = Number(value);
  if (!Number.isSafeInteger(id) || id <= 0) throw new Response(notFound, { status: 404 });
  return id;
}
