import type { ReactNode } from 'react';
import { ForbiddenState } from '../components/ui/forbidden-state';
import { useSession } from '../features/auth/api/get-session';
import { roleLabels } from '../../shared/schemas/common';
import { canOpen } from './navigation';

export interface RoleGateProps {
  /** The page's path as listed in navigation.ts; its roles decide. */
  path: string;
  pageName: string;
  children: ReactNode;
}

/** Renders the page only for roles that may open it; everyone else gets a clear explanation instead. */
export function RoleGate({ path, pageName, children }: RoleGateProps) {
  const user = useSession();
  if (!user) return null;
  if (!canOpen(path, user.role)) return <ForbiddenState pageName={pageName} roleLabel={roleLabels[user.role]} />;
  return <>{children}</>;
}
