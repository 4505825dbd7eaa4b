import { useCallback, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { PageHeader } from '../../../components/ui/page-header';
import { roleLabels } from '../../../../shared/schemas/common';
import type { User } from '../../../../shared/schemas/users';
import { useUsers } from '../api/get-users';
import { CreateUserDialog } from './create-user-dialog';
import { EditUserDialog } from './edit-user-dialog';
import { UsersTable } from './users-table';

export interface UsersAdminProps {
  currentUserId: number;
  /** After any saved change; the app refreshes the signed-in user when it was their own account. */
  onUserSaved?: (user: User) => void;
}

/** The admin's staff list with its create and edit dialogs. */
export function UsersAdmin({ currentUserId, onUserSaved }: UsersAdminProps) {
  const users = useUsers();
  const [creating, setCreating] = useState(false);
  const [editing, setEditing] = useState<{ id: number; open: boolean } | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const editedUser = editing ? (users.find((user) => user.id === editing.id) ?? null) : null;

  const startEditing = useCallback((user: User) => setEditing({ id: user.id, open: true }), []);

  return (
    <>
      <PageHeader
        eyebrow="Admin"
        title="Users"
        description="Everyone at the outlet who can sign in to Benchwire, and the role each one has."
        actions={
          <Button
            variant="primary"
            onClick={() => {
              setNotice(null);
              setCreating(true);
            }}
          >
            New user
          </Button>
        }
      />
      {notice && (
        <Alert tone="success" announce className="mb-4">
          {notice}
        </Alert>
      )}
      <UsersTable users={users} currentUserId={currentUserId} onEdit={startEditing} />

      <CreateUserDialog
        open={creating}
        onClose={() => setCreating(false)}
        onCreated={(user) => {
          setCreating(false);
          setNotice(`${user.displayName} can now sign in with ${user.email} as ${roleLabels[user.role]}.`);
        }}
      />
      <EditUserDialog
        user={editedUser}
        open={Boolean(editing?.open && editedUser)}
        isSelf={editedUser?.id === currentUserId}
        onClose={() => setEditing((current) => (current ? { ...current, open: false } : null))}
        onSaved={(user) => onUserSaved?.(user)}
      />
    </>
  );
}
