import type { EnsureQueryDataOptions, QueryClient, QueryKey } from '@tanstack/react-query';
import { Suspense, type ComponentType } from 'react';
import { useLoaderData, useParams, type LoaderFunctionArgs, type Params } from 'react-router';
import { sessionQueryOptions, useSession } from '../features/auth/api/get-session';
import { roundupQueryOptions } from '../features/roundups/api/get-roundup';
import { addressId } from '../lib/address-id';
import { paths } from '../lib/paths';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { Role } from '../../shared/schemas/common';
import { canOpen } from './navigation';
import type { RouteModule } from './router';
import { RoleGate } from './role-gate';
import { LoadingState } from '../components/ui/loading-state';

/** Warms what a page reads, for a user who may open it; `openedAt` is when the page was opened. */
export type WarmPage = (
  queryClient: QueryClient,
  args: LoaderFunctionArgs,
  user: CurrentUser,
  openedAt: number,
) => Promise<unknown>;

/**
 * A page's loader: it warms the session and then, only for a role that may open `path`, what the page reads — other
 * roles get an explanation, not a request the server would refuse. The page reads the query cache, and the moment it
 * was opened through useOpenedAt.
 */
export function pageLoader(path: string, warm?: WarmPage) {
  return (queryClient: QueryClient) => async (args: LoaderFunctionArgs) => {
    const openedAt = Date.now();
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (warm && user && canOpen(path, user.role)) await warm(queryClient, args, user, openedAt);
    return { openedAt };
  };
}

/** When the page was opened: "this week" and "today" on a page count from it, as its loader did. */
export function useOpenedAt(): number {
  return (useLoaderData() as { openedAt: number }).openedAt;
}

/**
 * The loader of a page within one roundup (`roundups/:id/…`): for a role that may open Roundups it warms the roundup
 * and what `warm` lists besides (an id that is not a number is "not found").
 */
export function roundupPageLoader(
  warm?: (queryClient: QueryClient, roundupId: number, args: LoaderFunctionArgs, user: CurrentUser) => unknown[],
) {
  return pageLoader(paths.roundups, (queryClient, args, user) => {
    const roundupId = addressId(args.params.id);
    return Promise.all([
      queryClient.ensureQueryData(roundupQueryOptions(roundupId)),
      ...(warm?.(queryClient, roundupId, args, user) ?? []),
    ]);
  });
}

export interface PageAccess {
  /** The page's place in the navigation; its roles decide who may open it. */
  path: string;
  pageName: string;
  /** A narrower rule than the place's (a New product page within the Catalog). */
  rule?: readonly Role[];
  /** What the page says while a part it reads is still loading; without it, the frame's loading state shows. */
  loading?: string;
}

/** A page for the roles that may open it; it receives the signed-in user, everyone else an explanation. */
export function gatedPage(access: PageAccess, Page: ComponentType<{ user: CurrentUser }>): ComponentType {
  return function GatedPage() {
    const user = useSession();
    return (
      <RoleGate path={access.path} pageName={access.pageName} rule={access.rule}>
        {user &&
          (access.loading ? (
            <Suspense fallback={<LoadingState label={access.loading} />}>
              <Page user={user} />
            </Suspense>
          ) : (
            <Page user={user} />
          ))}
      </RoleGate>
    );
  };
}

/** What a page within one roundup receives: the signed-in user, the roundup's id and the address's parameters. */
export interface RoundupPageProps {
  user: CurrentUser;
  roundupId: number;
  /** The address's parameters: a page reads its own further id (`cellId`, `entryId`) from them with addressId. */
  params: Params;
}

/**
 * A page within one roundup (`roundups/:id/…`), for the roles that may open Roundups: it receives the roundup's id,
 * read from the address and checked (an id that is not a number is "not found").
 */
export function roundupPage(access: Omit<PageAccess, 'path'>, Page: ComponentType<RoundupPageProps>): ComponentType {
  function RoundupIdPage({ user }: { user: CurrentUser }) {
    const params = useParams();
    return <Page user={user} roundupId={addressId(params.id)} params={params} />;
  }
  return gatedPage({ path: paths.roundups, ...access }, RoundupIdPage);
}

/**
 * The route of a page within one roundup that reads one query of its own besides the roundup (a view such as its
 * charts): the loader warms both, and the page receives the roundup's id as in roundupPage.
 */
export function roundupRoute<T, Key extends QueryKey>(
  access: Omit<PageAccess, 'path'>,
  read: (roundupId: number) => EnsureQueryDataOptions<T, Error, T, Key>,
  Page: ComponentType<RoundupPageProps>,
): RouteModule {
  return {
    loader: roundupPageLoader((queryClient, roundupId) => [queryClient.ensureQueryData(read(roundupId))]),
    Component: roundupPage(access, Page),
  };
}
