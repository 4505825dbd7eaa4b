import type { ReactNode } from 'react';
import { ForbiddenState } from '../components/ui/forbidden-state';
import { useSession } from '../features/auth/api/get-session';
import { roleLabels, type Role } from '../../shared/schemas/common';
import { may } from '../../shared/access/roles';
import { canOpen } from './navigation';

export interface RoleGateProps {
  /** The page's path as listed in navigation.ts; its roles decide. */
  path: string;
  pageName: string;
  /** A narrower rule than the place's, for a page within it (a New product page within the Catalog). */
  rule?: readonly Role[];
  children: ReactNode;
}

/** Renders the page only for roles that may open it; everyone else gets a clear explanation instead. */
export function RoleGate({ path, pageName, rule, children }: RoleGateProps) {
  const user = useSession();
  if (!user) return null;
  if (!canOpen(path, user.role) || (rule && !may(user.role, rule)))
    return <ForbiddenState pageName={pageName} roleLabel={roleLabels[user.role]} />;
  return <>{children}</>;
}
