// Listed explicitly so bundled builds and the CLI see the same entity set.
import { AuditEntryEntity } from './audit-entry.entity';
import { SessionEntity } from './session.entity';
import { UserEntity } from './user.entity';

export const entities = [UserEntity, SessionEntity, AuditEntryEntity];
