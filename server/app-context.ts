import type { DataSource } from 'typeorm';
import type { Env } from './env';
import type { Services } from './compose-services';

/** What every feature's routes receive: the database, the validated config and the services built once. */
export interface AppContext {
  dataSource: DataSource;
  env: Env;
  services: Services;
}
