import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { registerAccountRoutes } from './account.routes';
import { registerLogCheckRoutes } from './log-check.routes';
import { registerAuthRoutes } from './auth.routes';
import { registerSystemRoutes } from './system.routes';
import { registerUserRoutes } from './users.routes';
import { registerBenchProfileRoutes } from './bench-profiles.routes';
import { registerBenchRoutes } from './benches.routes';
import { registerCalendarFeedRoutes } from './calendar-feed.routes';
import { registerCatalogRoutes } from './catalog.routes';
import { registerLoadConfigurationRoutes } from './load-configurations.routes';
import { registerMatrixRoutes } from './matrix.routes';
import { registerMyBenchRoutes } from './my-bench.routes';
import { registerRoundupEntryRoutes } from './roundup-entries.routes';
import { registerRoundupRoutes } from './roundups.routes';
import { registerSampleRoutes } from './samples.routes';
import { registerTestRunRoutes } from './test-runs.routes';
import { registerPhotoRoutes } from './photos.routes';
import { registerWriteUpRoutes } from './write-ups.routes';
import { registerDevInboxRoutes } from './dev-inbox.routes';
import { registerSubscriberRoutes } from './subscribers.routes';

/** Every feature's routes. A new feature adds one line here. */
export function registerFeatureRoutes(api: ApiRegistry, context: AppContext) {
  registerSystemRoutes(api, context);
  registerAuthRoutes(api, context);
  registerAccountRoutes(api, context);
  registerUserRoutes(api, context);
  registerLogCheckRoutes(api, context);
  registerCatalogRoutes(api, context);
  registerBenchProfileRoutes(api, context);
  registerLoadConfigurationRoutes(api, context);
  registerRoundupRoutes(api, context);
  registerRoundupEntryRoutes(api, context);
  registerMatrixRoutes(api, context);
  registerSampleRoutes(api, context);
  registerBenchRoutes(api, context);
  registerMyBenchRoutes(api, context);
  registerCalendarFeedRoutes(api, context);
  registerTestRunRoutes(api, context);
  registerPhotoRoutes(api, context);
  registerWriteUpRoutes(api, context);
  registerDevInboxRoutes(api, context);
  registerSubscriberRoutes(api, context);
}
