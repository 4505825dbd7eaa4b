import type { EntityManager } from 'typeorm';
import { UserEntity } from '../entities/user.entity';
import { hashPassword } from '../auth/passwords';
import type { Role } from '../../shared/schemas/common';

/** The invented outlet's staff: one account per role. Passwords are printed by `npm start` and in the README. */
export const demoAccounts: { email: string; displayName: string; role: Role; password: string }[] = [
  { email: 'admin@soaksheet.example', displayName: 'Oda Brennick', role: 'admin', password: 'demo-admin-pass' },
  { email: 'editor@soaksheet.example', displayName: 'Tamsin Whorley', role: 'editor', password: 'demo-editor-pass' },
  { email: 'writer@soaksheet.example', displayName: 'Ravi Ostlund', role: 'writer', password: 'demo-writer-pass' },
  { email: 'tester@soaksheet.example', displayName: 'Jules Marrow', role: 'tester', password: 'demo-tester-pass' },
];

export async function seedStaff(manager: EntityManager) {
  const repo = manager.getRepository(UserEntity);
  const users: Record<Role, UserEntity> = {} as Record<Role, UserEntity>;
  for (const account of demoAccounts) {
    const user = repo.create({
      email: account.email,
      displayName: account.displayName,
      role: account.role,
      passwordHash: await hashPassword(account.password),
      active: true,
    });
    users[account.role] = await repo.save(user);
  }
  // A second tester, so assignments have a choice.
  const second = await repo.save(
    repo.create({
      email: 'tester2@soaksheet.example',
      displayName: 'Priya Lindqvist-Amaro',
      role: 'tester',
      passwordHash: await hashPassword('demo-tester2-pass'),
      active: true,
    }),
  );
  return { ...users, secondTester: second };
}
