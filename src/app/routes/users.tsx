import { useQueryClient } from '@tanstack/react-query';
import { paths } from '../../lib/paths';
import { sessionKey } from '../../features/auth/api/auth-keys';
import { usersQueryOptions } from '../../features/users/api/get-users';
import { UsersAdmin } from '../../features/users/components/users-admin';

import { gatedPage, pageLoader } from '../page-route';
import type { CurrentUser } from '../../../shared/schemas/auth';
export const loader = pageLoader(paths.users, (queryClient) => queryClient.ensureQueryData(usersQueryOptions()));

export const Component = gatedPage({ path: paths.users, pageName: 'Users' }, UsersPage);

function UsersPage({ user }: { user: CurrentUser }) {
  const queryClient = useQueryClient();
  return (
    <UsersAdmin
      currentUserId={user.id}
      onUserSaved={(saved) => {
        if (saved.id === user.id) void queryClient.invalidateQueries({ queryKey: sessionKey });
      }}
    />
  );
}
