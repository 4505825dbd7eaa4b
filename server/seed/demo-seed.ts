import type { DataSource } from 'typeorm';
import { UserEntity } from '../entities/user.entity';
import { seedPlanning } from './demo-planning';
import { seedStaff } from './demo-staff';

/** Seeds the invented demo outlet once: only into a database that has no users yet. Returns whether it ran. */
export async function seedDemoOnce(dataSource: DataSource): Promise<boolean> {
  if ((await dataSource.getRepository(UserEntity).count()) > 0) return false;
  await dataSource.transaction(async (manager) => {
    const staff = await seedStaff(manager);
    await seedPlanning(manager, { editor: staff.editor, tester: staff.tester, secondTester: staff.secondTester });
  });
  return true;
}
