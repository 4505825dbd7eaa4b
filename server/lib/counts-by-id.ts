import type { EntityManager } from 'typeorm';

/**
 * Runs a `SELECT … AS id, COUNT(*) AS n … IN (…) GROUP BY …` query for the given ids and returns the counts by
 * id; ids without rows are left out. `sql` receives the placeholder list for the IN clause.
 */
export async function countsById(
  manager: EntityManager,
  sql: (inList: string) => string,
  ids: number[],
): Promise<Map<number, number>> {
  const counts = new Map<number, number>();
  if (ids.length === 0) return counts;
  const rows: { id: number | string; n: string }[] = await manager.query(sql(ids.map(() => '?').join(',')), ids);
  for (const row of rows) counts.set(Number(row.id), Number(row.n));
  return counts;
}
