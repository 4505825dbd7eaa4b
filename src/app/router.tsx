import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, type LoaderFunction } from 'react-router';
import type { ComponentType } from 'react';
import { setUnauthorizedHandler } from '../lib/api-client';
import { paths } from '../lib/paths';
import { sessionKey } from '../features/auth/api/auth-keys';
import { LoadingState } from '../components/ui/loading-state';
import * as appLayout from './routes/app-layout';
import * as signIn from './routes/sign-in';
import { RootErrorBoundary } from './routes/root-error-boundary';
import { RouteErrorBoundary } from './routes/route-error-boundary';

/** What every file in app/routes exports: the page, and optionally a loader that warms the query cache. */
export interface RouteModule {
  Component: ComponentType;
  loader?: (queryClient: QueryClient) => LoaderFunction;
}

function FullPageLoading() {
  return <LoadingState fullPage label="Opening Benchwire…" />;
}

/**
 * All client routes. To add a page: create app/routes/<page>.tsx exporting Component (and loader), add a line to the
 * children below, and a line to app/navigation.ts if it belongs in the side navigation.
 */
export function createAppRouter(queryClient: QueryClient) {
  const load = (module: RouteModule) => ({ Component: module.Component, loader: module.loader?.(queryClient) });
  // Pages load on first visit, so later heavy screens (editor, charts) do not weigh on sign-in.
  const lazy = (importer: () => Promise<RouteModule>) => async () => load(await importer());

  const router = createBrowserRouter([
    {
      id: 'root',
      HydrateFallback: FullPageLoading,
      ErrorBoundary: RootErrorBoundary,
      children: [
        { path: 'sign-in', ...load(signIn) },
        { path: 'welcome/:token', lazy: lazy(() => import('./routes/welcome')) },
        {
          id: 'app',
          ...load(appLayout),
          children: [
            {
              // Errors of a page show inside the frame, so the navigation stays usable.
              ErrorBoundary: RouteErrorBoundary,
              children: [
                { index: true, lazy: lazy(() => import('./routes/dashboard')) },
                { path: 'users', lazy: lazy(() => import('./routes/users')) },
                { path: 'account', lazy: lazy(() => import('./routes/account')) },
                { path: 'catalog', lazy: lazy(() => import('./routes/catalog')) },
                { path: 'catalog/new', lazy: lazy(() => import('./routes/catalog-new')) },
                { path: 'catalog/import', lazy: lazy(() => import('./routes/catalog-import')) },
                { path: 'catalog/:productId', lazy: lazy(() => import('./routes/catalog-product')) },
                { path: 'catalog/:productId/edit', lazy: lazy(() => import('./routes/catalog-product-edit')) },
                { path: 'benches', lazy: lazy(() => import('./routes/benches')) },
                { path: 'benches/:benchId', lazy: lazy(() => import('./routes/bench-detail')) },
                { path: 'log-check', lazy: lazy(() => import('./routes/log-check')) },
                { path: 'roundups', lazy: lazy(() => import('./routes/roundups')) },
                { path: 'roundups/new', lazy: lazy(() => import('./routes/roundup-new')) },
                { path: 'roundups/:id', lazy: lazy(() => import('./routes/roundup-detail')) },
                { path: 'roundups/:id/write-up', lazy: lazy(() => import('./routes/write-up')) },
                { path: 'roundups/:id/write-up/:sectionId', lazy: lazy(() => import('./routes/write-up-section')) },
                { path: 'roundups/:id/verdicts', lazy: lazy(() => import('./routes/roundup-verdicts')) },
                { path: 'roundups/:id/charts', lazy: lazy(() => import('./routes/roundup-charts')) },
                { path: 'roundups/:id/readiness', lazy: lazy(() => import('./routes/roundup-readiness')) },
                { path: 'roundups/:id/cells/:cellId', lazy: lazy(() => import('./routes/roundup-cell')) },
                {
                  path: 'roundups/:id/products/:entryId/photos',
                  lazy: lazy(() => import('./routes/roundup-entry-photos')),
                },
                { path: 'my-bench', lazy: lazy(() => import('./routes/my-bench')) },
                { path: 'dev-inbox', lazy: lazy(() => import('./routes/dev-inbox')) },
                { path: 'subscribers', lazy: lazy(() => import('./routes/subscribers')) },
                { path: '*', lazy: lazy(() => import('./routes/not-found')) },
              ],
            },
          ],
        },
      ],
    },
  ]);

  // A request answered 401 means the session ended (expired, revoked, account deactivated): sign in again, then
  // come back to the same page.
  setUnauthorizedHandler(() => {
    queryClient.setQueryData(sessionKey, null);
    // During a navigation the page being opened is where the user wanted to go.
    const { pathname, search } = router.state.navigation.location ?? router.state.location;
    if (pathname !== '/sign-in') void router.navigate(paths.signIn(pathname + search), { replace: true });
  });

  return router;
}
