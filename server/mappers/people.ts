import { In, type EntityManager } from 'typeorm';
import { UserEntity } from '../entities/user.entity';
import type { PersonRef } from '../../shared/schemas/planning-fields';

/** Staff members by id, as records mention them (id + display name). Unknown ids are left out. */
export async function loadPeople(
  manager: EntityManager,
  ids: Iterable<number | null>,
): Promise<Map<number, PersonRef>> {
  const wanted = [...new Set([...ids].filter((id): id is number => id != null))];
  const people = new Map<number, PersonRef>();
  if (wanted.length === 0) return people;
  const users = await manager
    .getRepository(UserEntity)
    .find({ where: { id: In(wanted) }, select: { id: true, displayName: true } });
  for (const user of users) people.set(user.id, { id: user.id, displayName: user.displayName });
  return people;
}

export function personOrNull(people: Map<number, PersonRef>, id: number | null): PersonRef | null {
  return id == null ? null : (people.get(id) ?? null);
}
