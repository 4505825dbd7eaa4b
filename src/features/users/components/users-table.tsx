import { useMemo, useState } from 'react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { DateTime } from '../../../components/ui/date-time';
import { Select } from '../../../components/ui/select';
import { userTimeZone } from '../../../lib/format-time';
import { roleLabels } from '../../../../shared/schemas/common';
import type { User } from '../../../../shared/schemas/users';

export interface UsersTableProps {
  users: readonly User[];
  currentUserId: number;
  onEdit: (user: User) => void;
}

type StatusFilter = 'all' | 'active' | 'inactive';
const statusOptions = [
  { value: 'all', label: 'All accounts' },
  { value: 'active', label: 'Active only' },
  { value: 'inactive', label: 'Deactivated only' },
];

export function UsersTable({ users, currentUserId, onEdit }: UsersTableProps) {
  const [status, setStatus] = useState<StatusFilter>('all');
  const rows = useMemo(
    () => users.filter((user) => status === 'all' || user.active === (status === 'active')),
    [users, status],
  );

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
      {
        id: 'email',
        header: 'E-mail',
        sortValue: (user) => user.email,
        cell: (user) => <span className="whitespace-nowrap">{user.email}</span>,
      },
      {
        id: 'role',
        header: 'Role',
        sortValue: (user) => roleLabels[user.role],
        cell: (user) => <span className="whitespace-nowrap">{roleLabels[user.role]}</span>,
      },
      {
        id: 'status',
        header: 'Status',
        sortValue: (user) => (user.active ? 'Active' : 'Deactivated'),
        cell: (user) => (user.active ? <Badge tone="positive">Active</Badge> : <Badge tone="muted">Deactivated</Badge>),
      },
      {
        id: 'lastSignIn',
        header: 'Last sign-in',
        numeric: true,
        sortValue: (user) => (user.lastSignInAt ? Date.parse(user.lastSignInAt) : null),
        cell: (user) => <DateTime value={user.lastSignInAt} fallback="Never" />,
      },
      {
        id: 'actions',
        header: 'Actions',
        numeric: false,
        cell: (user) => (
          <Button size="sm" variant="secondary" onClick={() => onEdit(user)} aria-label={`Edit ${user.displayName}`}>
            Edit
          </Button>
        ),
      },
    ],
    [currentUserId, onEdit],
  );

  return (
    <DataTable
      caption="Staff accounts"
      rows={rows}
      columns={columns}
      rowKey={(user) => user.id}
      initialSort={{ columnId: 'name', direction: 'ascending' }}
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
      footnote={
        <>
          Times are in <strong className="font-medium">{userTimeZone()}</strong>, the time zone of this device.
        </>
      }
    />
  );
}
