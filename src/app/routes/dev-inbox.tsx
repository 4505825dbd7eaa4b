import type { QueryClient } from '@tanstack/react-query';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { sessionQueryOptions } from '../../features/auth/api/get-session';
import { devInboxQueryOptions } from '../../features/mail/api/get-dev-inbox';
import { DevInbox } from '../../features/mail/components/dev-inbox';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';

export function loader(queryClient: QueryClient) {
  return async () => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (user && canOpen(paths.devInbox, user.role)) await queryClient.ensureQueryData(devInboxQueryOptions());
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.devInbox} pageName="Dev inbox">
      <PageHeader
        title="Dev inbox"
        description="What the local mail relay received. Nothing here reaches a real mailbox."
      />
      <DevInbox />
    </RoleGate>
  );
}
