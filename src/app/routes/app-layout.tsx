import { Suspense, useState } from 'react';
import { Outlet, redirect, useNavigate, useNavigation, type LoaderFunctionArgs } from 'react-router';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { AppShell } from '../../components/layouts/app-shell';
import { Alert } from '../../components/ui/alert';
import { LoadingState } from '../../components/ui/loading-state';
import { isApiError } from '../../lib/api-client';
import { paths } from '../../lib/paths';
import { authKeys, sessionKey } from '../../features/auth/api/auth-keys';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { useSignOut } from '../../features/auth/api/sign-out';
import { roleLabels } from '../../../shared/schemas/common';
import { navigationFor } from '../navigation';
import { useDevInboxAvailable } from '../../features/mail/api/get-dev-inbox';
import { may, placeAccess } from '../../../shared/access/roles';

/** Every staff page sits below this route: without a session, the user is sent to sign in first. */
export function loader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    const user = await queryClient.ensureQueryData({ ...sessionQueryOptions(), revalidateIfStale: true });
    if (!user) {
      const url = new URL(request.url);
      throw redirect(paths.signIn(url.pathname + url.search));
    }
    return null;
  };
}

export function Component() {
  const user = useSession();
  const navigation = useNavigation();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const signOut = useSignOut();
  const [signOutError, setSignOutError] = useState<string | null>(null);
  // The dev inbox exists only with the local mail relay; with a real relay its entry is left out.
  const devInbox = useDevInboxAvailable(Boolean(user && may(user.role, placeAccess.devInbox)));

  // Signed out a moment ago (or the session ended): the page is on its way to the sign-in screen.
  if (!user) return <LoadingState fullPage label="Signing out…" />;

  const leave = async () => {
    queryClient.setQueryData(sessionKey, null);
    await navigate(paths.signIn(), { replace: true });
    // Nothing of this user's stays in memory for whoever signs in next on this device.
    queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
  };

  const handleSignOut = () => {
    setSignOutError(null);
    signOut.mutate(undefined, {
      onSuccess: leave,
      onError: (error) => {
        // Already signed out on the server: the outcome the user wanted.
        if (isApiError(error) && error.status === 401) return void leave();
        setSignOutError(`Signing out did not work: ${error.message} Try again.`);
      },
    });
  };

  return (
    <AppShell
      user={{ displayName: user.displayName, roleLabel: roleLabels[user.role] }}
      navigation={navigationFor(user.role).filter((entry) => devInbox || entry.to !== paths.devInbox)}
      onSignOut={handleSignOut}
      signingOut={signOut.isPending}
      busy={navigation.state === 'loading'}
    >
      {signOutError && (
        <Alert tone="danger" announce className="mb-4">
          {signOutError}
        </Alert>
      )}
      <Suspense fallback={<LoadingState />}>
        <Outlet />
      </Suspense>
    </AppShell>
  );
}
