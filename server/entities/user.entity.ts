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

  /** null until an invited person sets their password: such an account cannot sign in. */
  @Column({ type: 'varchar', length: 255, name: 'password_hash', nullable: true })
  passwordHash: string | null;

  @Column({ type: 'boolean', default: true })
  active: boolean;

  @Column({ type: 'datetime', precision: 3, name: 'last_sign_in_at', nullable: true })
  lastSignInAt: Date | null;

  /** SHA-256 (hex) of the open or used invitation link's token; null when none was sent or it was withdrawn. */
  @Column({ type: 'char', length: 64, name: 'invite_token_hash', nullable: true })
  inviteTokenHash: string | null;

  @Column({ type: 'datetime', precision: 3, name: 'invite_expires_at', nullable: true })
  inviteExpiresAt: Date | null;

  @Column({ type: 'datetime', precision: 3, name: 'invite_sent_at', nullable: true })
  inviteSentAt: Date | null;

  @Column({ type: 'datetime', precision: 3, name: 'invite_accepted_at', nullable: true })
  inviteAcceptedAt: Date | null;
}
