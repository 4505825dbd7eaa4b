import { useSession } from '../../features/auth/api/get-session';
import { RoleWelcome } from '../../features/dashboard/components/role-welcome';
import { paths } from '../../lib/paths';
import { navigationFor } from '../navigation';

export function Component() {
  const user = useSession();
  if (!user) return null;
  const places = navigationFor(user.role).filter((entry) => entry.to !== paths.dashboard);
  return <RoleWelcome user={user} places={places} />;
}
