import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import type { LoaderFunctionArgs } from 'react-router';
import { sessionQueryOptions, useSession } from '../features/auth/api/get-session';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { Role } from '../../shared/schemas/common';
import { canOpen } from './navigation';
import { RoleGate } from './role-gate';

/** Warms what a page reads, for a user who may open it. */
export type WarmPage = (queryClient: QueryClient, args: LoaderFunctionArgs, user: CurrentUser) => Promise<unknown>;

/**
 * A page's loader: it warms the session and then, only for a role that may open `path`, what the page reads — other
 * roles get an explanation, not a request the server would refuse. Returns null (the page reads the query cache).
 */
export function pageLoader(path: string, warm?: WarmPage) {
  return (queryClient: QueryClient) => async (args: LoaderFunctionArgs) => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (warm && user && canOpen(path, user.role)) await warm(queryClient, args, user);
    return null;
  };
}

export interface PageAccess {
  /** The page's place in the navigation; its roles decide who may open it. */
  path: string;
  pageName: string;
  /** A narrower rule than the place's (a New product page within the Catalog). */
  rule?: readonly Role[];
}

/** A page for the roles that may open it; it receives the signed-in user, everyone else an explanation. */
export function gatedPage(access: PageAccess, Page: ComponentType<{ user: CurrentUser }>): ComponentType {
  return function GatedPage() {
    const user = useSession();
    return (
      <RoleGate path={access.path} pageName={access.pageName} rule={access.rule}>
        {user && <Page user={user} />}
      </RoleGate>
    );
  };
}
