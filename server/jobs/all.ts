import type { Services } from '../compose-services';
import { JobRegistry } from './job-registry';
import { publishRoundupJob } from './publish-roundup.job';
import { publishRoundupJobKind } from '../services/publishing.service';

/** Every kind of job the server runs, with its handler. A new kind of work adds one line here. */
export function createJobRegistry(services: Services): JobRegistry {
  const registry = new JobRegistry();
  registry.register(publishRoundupJobKind, publishRoundupJob(services.publishing));
  return registry;
}
