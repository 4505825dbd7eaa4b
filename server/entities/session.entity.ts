import { CreateDateColumn, Entity, Index, ManyToOne, JoinColumn, PrimaryColumn } from 'typeorm';
import { IntColumn, InstantColumn, VarcharColumn } from './columns';
import { UserEntity } from './user.entity';

@Entity({ name: 'sessions' })
export class SessionEntity {
  @PrimaryColumn({ type: 'varchar', length: 64 })
  id: string;

  @Index()
  @IntColumn('user_id')
  userId: number;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user?: UserEntity;

  @Index()
  @InstantColumn('expires_at')
  expiresAt: Date;

  @CreateDateColumn({ type: 'datetime', precision: 3, name: 'created_at' })
  createdAt: Date;

  @VarcharColumn(255, { name: 'user_agent', nullable: true })
  userAgent: string | null;

  @VarcharColumn(64, { name: 'ip_address', nullable: true })
  ipAddress: string | null;
}
