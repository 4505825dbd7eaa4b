import type { DataSource } from 'typeorm';
import { UserEntity } from '../entities/user.entity';
import { seedStaff } from './demo-staff';

/** Seeds the invented demo outlet once: only into a database that has no users yet. Returns whether it ran. */
export async function seedDemoOnce(dataSource: DataSource): Promise<boolean> {
  if ((await dataSource.getRepository(UserEntity).count()) > 0) return false;
  await dataSource.transaction(async (manager) => {
    await seedStaff(manager);
  });
  return true;
}
