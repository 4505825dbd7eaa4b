import { Column, Entity } from 'typeorm';
import { OptionalInstantColumn, VarcharColumn } from './columns';
import { EditedEntity } from './base-entities';
import type { Role } from '../../shared/schemas/common';

@Entity({ name: 'users' })
export class UserEntity extends EditedEntity {
  @VarcharColumn(254, { unique: true })
  email: string;

  @VarcharColumn(120, { name: 'display_name' })
  displayName: string;

  @Column({ type: 'enum', enum: ['admin', 'editor', 'writer', 'tester'] })
  role: Role;

  /** null until an invited person sets their password: such an account cannot sign in. */
  @VarcharColumn(255, { name: 'password_hash', nullable: true })
  passwordHash: string | null;

  @Column({ type: 'boolean', default: true })
  active: boolean;

  @OptionalInstantColumn('last_sign_in_at')
  lastSignInAt: Date | null;

  /** SHA-256 (hex) of the open or used invitation link's token; null when none was sent or it was withdrawn. */
  @Column({ type: 'char', length: 64, name: 'invite_token_hash', nullable: true })
  inviteTokenHash: string | null;

  @OptionalInstantColumn('invite_expires_at')
  inviteExpiresAt: Date | null;

  @OptionalInstantColumn('invite_sent_at')
  inviteSentAt: Date | null;

  @OptionalInstantColumn('invite_accepted_at')
  inviteAcceptedAt: Date | null;
}
