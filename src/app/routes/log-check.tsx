import type { QueryClient } from '@tanstack/react-query';
import { paths } from '../../lib/paths';
import { sessionQueryOptions } from '../../features/auth/api/get-session';
import { LogCheckPage } from '../../features/log-check/components/log-check-page';
import { RoleGate } from '../role-gate';

/** The page loads nothing up front: the tester's file is the data. */
export function loader(queryClient: QueryClient) {
  return async () => {
    await queryClient.ensureQueryData(sessionQueryOptions());
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.logCheck} pageName="Log check">
      <LogCheckPage signInPath={paths.signIn(paths.logCheck)} />
    </RoleGate>
  );
}
