import { useMemo, useState } from 'react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { actionsColumn, dateColumn, textColumn } from '../../../components/ui/data-table-columns';
import { DateTime, DeviceTimeZoneNote } from '../../../components/ui/date-time';
import { Select } from '../../../components/ui/select';
import { roleLabels } from '../../../../shared/schemas/common';
import type { User } from '../../../../shared/schemas/users';

export interface UsersTableProps {
  users: readonly User[];
  currentUserId: number;
  onEdit: (user: User) => void;
  /** Sends an invited person a new link (the earlier one stops working). */
  onSendAgain: (user: User) => void;
  /** Withdraws an invitation: the account is deactivated and its link stops working. */
  onWithdraw: (user: User) => void;
  /** The account whose invitation is being sent just now. */
  sendingId?: number | null;
}

/** The account's state in words, for sorting and filtering. */
export function statusWords(user: User): string {
  if (!user.active) return user.passwordSet ? 'Deactivated' : 'Invitation withdrawn';
  if (user.passwordSet) return 'Active';
  if (!user.invitation) return 'Invited — no open link';
  return user.invitation.expired ? 'Invited — link expired' : 'Invited — not yet accepted';
}

function UserStatus({ user }: { user: User }) {
  const words = statusWords(user);
  if (user.active && user.passwordSet) return <Badge tone="positive">Active</Badge>;
  if (!user.active) return <Badge tone="muted">{words}</Badge>;
  return (
    <span className="inline-flex flex-col items-start gap-0.5">
      <Badge tone="caution">{words}</Badge>
      {user.invitation && (
        <span className="text-xs whitespace-nowrap text-muted">
          {user.invitation.expired ? 'expired ' : 'expires '}
          <DateTime value={user.invitation.expiresAt} />
        </span>
      )}
    </span>
  );
}

type StatusFilter = 'all' | 'active' | 'invited' | 'inactive';
const statusOptions = [
  { value: 'all', label: 'All accounts' },
  { value: 'active', label: 'Active only' },
  { value: 'invited', label: 'Invited, not yet accepted' },
  { value: 'inactive', label: 'Deactivated only' },
];
const statusFilters: Record<StatusFilter, (user: User) => boolean> = {
  all: () => true,
  active: (user) => user.active,
  invited: (user) => user.active && !user.passwordSet,
  inactive: (user) => !user.active,
};

export function UsersTable({
  users,
  currentUserId,
  onEdit,
  onSendAgain,
  onWithdraw,
  sendingId = null,
}: UsersTableProps) {
  const [status, setStatus] = useState<StatusFilter>('all');
  const rows = useMemo(() => users.filter(statusFilters[status]), [users, status]);

  const columns = useMemo<DataTableColumn<User>[]>(
    () => [
      {
        id: 'name',
        header: 'Name',
        rowHeader: true,
        sortValue: (user) => user.displayName,
        cell: (user) => (
          <span className="whitespace-nowrap">
            {user.displayName}
            {user.id === currentUserId && <span className="ml-1.5 text-xs font-normal text-muted">(you)</span>}
          </span>
        ),
      },
      textColumn('email', 'E-mail', (user) => user.email, { className: 'whitespace-nowrap' }),
      textColumn('role', 'Role', (user) => roleLabels[user.role], { className: 'whitespace-nowrap' }),
      {
        id: 'status',
        header: 'Status',
        sortValue: statusWords,
        cell: (user) => <UserStatus user={user} />,
      },
      dateColumn('lastSignIn', 'Last sign-in', (user) => user.lastSignInAt, { instant: true, empty: 'Never' }),
      actionsColumn((user) => (
        <span className="flex flex-wrap gap-1.5">
          <Button size="sm" variant="secondary" onClick={() => onEdit(user)} aria-label={`Edit ${user.displayName}`}>
            Edit
          </Button>
          {user.active && !user.passwordSet && (
            <>
              <Button
                size="sm"
                variant="secondary"
                pending={sendingId === user.id}
                onClick={() => onSendAgain(user)}
                aria-label={`Send the invitation to ${user.displayName} again`}
              >
                Send again
              </Button>
              <Button
                size="sm"
                variant="secondary"
                onClick={() => onWithdraw(user)}
                aria-label={`Withdraw the invitation to ${user.displayName}`}
              >
                Withdraw
              </Button>
            </>
          )}
        </span>
      )),
    ],
    [currentUserId, onEdit, onSendAgain, onWithdraw, sendingId],
  );

  return (
    <DataTable
      caption="Staff accounts"
      rows={rows}
      columns={columns}
      initialSort="name"
      filter={{ label: 'Filter users', placeholder: 'Name, e-mail or role' }}
      noun={['account', 'accounts']}
      toolbar={
        <Select
          label="Show"
          options={statusOptions}
          value={status}
          onChange={(event) => setStatus(event.target.value as StatusFilter)}
          className="w-full sm:w-48"
        />
      }
      rowClassName={(user) => (user.active ? undefined : 'text-muted')}
      footnote={<DeviceTimeZoneNote />}
    />
  );
}
