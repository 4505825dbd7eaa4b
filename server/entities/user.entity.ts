import { Column, Entity } from 'typeorm';
import { EditedEntity } from './base-entities';
import type { Role } from '../../shared/schemas/common';

@Entity({ name: 'users' })
export class UserEntity extends EditedEntity {
  @Column({ type: 'varchar', length: 254, unique: true })
  email: string;

  @Column({ type: 'varchar', length: 120, name: 'display_name' })
  displayName: string;

  @Column({ type: 'enum', enum: ['admin', 'editor', 'writer', 'tester'] })
  role: Role;

  @Column({ type: 'varchar', length: 255, name: 'password_hash' })
  passwordHash: string;

  @Column({ type: 'boolean', default: true })
  active: boolean;

  @Column({ type: 'datetime', precision: 3, name: 'last_sign_in_at', nullable: true })
  lastSignInAt: Date | null;
}
