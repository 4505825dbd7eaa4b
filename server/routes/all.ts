import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { registerAccountRoutes } from './account.routes';
import { registerAnalysisRoutes } from './analysis.routes';
import { registerAuthRoutes } from './auth.routes';
import { registerSystemRoutes } from './system.routes';
import { registerUserRoutes } from './users.routes';

/** Every feature's routes. A new feature adds one line here. */
export function registerFeatureRoutes(api: ApiRegistry, context: AppContext) {
  registerSystemRoutes(api, context);
  registerAuthRoutes(api, context);
  registerAccountRoutes(api, context);
  registerUserRoutes(api, context);
  registerAnalysisRoutes(api, context);
}
