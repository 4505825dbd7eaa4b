// Every migration, in order. A new schema change adds its class here.
import { CreateUsersSessionsAudit1764600000000 } from './1764600000000-create-users-sessions-audit';

export const migrations = [CreateUsersSessionsAudit1764600000000];
