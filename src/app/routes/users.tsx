import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { paths } from '../../lib/paths';
import { sessionKey } from '../../features/auth/api/auth-keys';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { usersQueryOptions } from '../../features/users/api/get-users';
import { UsersAdmin } from '../../features/users/components/users-admin';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';

export function loader(queryClient: QueryClient) {
  return async () => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    // Other roles get an explanation, not a request the server would refuse.
    if (user && canOpen(paths.users, user.role)) await queryClient.ensureQueryData(usersQueryOptions());
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.users} pageName="Users">
      <UsersPage />
    </RoleGate>
  );
}

function UsersPage() {
  const user = useSession();
  const queryClient = useQueryClient();
  if (!user) return null;
  return (
    <UsersAdmin
      currentUserId={user.id}
      onUserSaved={(saved) => {
        if (saved.id === user.id) void queryClient.invalidateQueries({ queryKey: sessionKey });
      }}
    />
  );
}
