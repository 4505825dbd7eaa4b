import type { Services } from '../compose-services';
import { JobRegistry } from './job-registry';

/** Every kind of job the server runs, with its handler. A new kind of work adds one line here. */
export function createJobRegistry(services: Services): JobRegistry {
  const registry = new JobRegistry();
  void services;
  return registry;
}
