import type { DataSource } from 'typeorm';
import type { Env } from './env';
import type { SessionStore } from './auth/session-store';

/** What every feature's routes receive: the database, the session store and the validated config. */
export interface AppContext {
  dataSource: DataSource;
  sessions: SessionStore;
  env: Env;
}
