import { In, type EntityManager, type EntityTarget, type FindOptionsSelect, type FindOptionsWhere } from 'typeorm';

/**
 * The rows of `entity` that `items` refer to (`keyOf` gives each item's key), by key: for lists that show each
 * item's roundup, entry or configuration. A key several items share is read once; `select` narrows the columns.
 */
export async function rowsById<E extends { id: number }, T>(
  manager: EntityManager,
  entity: EntityTarget<E>,
  items: readonly T[],
  keyOf: (item: T) => number,
  select?: FindOptionsSelect<E>,
): Promise<Map<number, E>> {
  const unique = [...new Set(items.map(keyOf))];
  if (unique.length === 0) return new Map();
  const where = { id: In(unique) } as FindOptionsWhere<E>;
  const rows = await manager.getRepository(entity).find({ where, select });
  return new Map(rows.map((row) => [row.id, row]));
}
