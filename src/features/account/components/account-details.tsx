import { Panel } from '../../../components/ui/panel';
import { roleGuides } from '../../../lib/role-guide';
import { roleLabels } from '../../../../shared/schemas/common';
import type { CurrentUser } from '../../../../shared/schemas/auth';

export interface AccountDetailsProps {
  user: CurrentUser;
}

export function AccountDetails({ user }: AccountDetailsProps) {
  return (
    <Panel title="Your details" description="An admin of your outlet changes names, e-mail addresses and roles.">
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[8rem_minmax(0,1fr)]">
        <dt className="font-semibold text-muted">Name</dt>
        <dd>{user.displayName}</dd>
        <dt className="font-semibold text-muted">E-mail</dt>
        <dd className="break-all">{user.email}</dd>
        <dt className="font-semibold text-muted">Role</dt>
        <dd>
          {roleLabels[user.role]}
          <span className="block text-muted">{roleGuides[user.role].summary}</span>
        </dd>
      </dl>
    </Panel>
  );
}
