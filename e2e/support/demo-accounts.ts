import type { Role } from '../../shared/schemas/common';

export interface DemoAccount {
  email: string;
  password: string;
  displayName: string;
  role: Role;
  roleLabel: string;
}

/** The seeded staff of the invented demo outlet (server/seed/demo-staff.ts). */
export const demoAccounts: Record<Role, DemoAccount> = {
  admin: {
    email: 'admin@soaksheet.example',
    password: 'demo-admin-pass',
    displayName: 'Oda Brennick',
    role: 'admin',
    roleLabel: 'Admin',
  },
  editor: {
    email: 'editor@soaksheet.example',
    password: 'demo-editor-pass',
    displayName: 'Tamsin Whorley',
    role: 'editor',
    roleLabel: 'Editor',
  },
  writer: {
    email: 'writer@soaksheet.example',
    password: 'demo-writer-pass',
    displayName: 'Ravi Ostlund',
    role: 'writer',
    roleLabel: 'Writer',
  },
  tester: {
    email: 'tester@soaksheet.example',
    password: 'demo-tester-pass',
    displayName: 'Jules Marrow',
    role: 'tester',
    roleLabel: 'Bench tester',
  },
};
