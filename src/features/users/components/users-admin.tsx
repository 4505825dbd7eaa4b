import { useCallback, useState } from 'react';
import { Alert, AnnouncedAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { PageHeader } from '../../../components/ui/page-header';
import { roleLabels } from '../../../../shared/schemas/common';
import type { User } from '../../../../shared/schemas/users';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { DateTime } from '../../../components/ui/date-time';
import { useUsers } from '../api/get-users';
import { useSendInvitation } from '../api/send-invitation';
import { useUpdateUser } from '../api/update-user';
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
  const sendInvitation = useSendInvitation();
  const withdrawInvitation = useUpdateUser();
  const [withdrawing, setWithdrawing] = useState<User | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [invited, setInvited] = useState<User | null>(null);

  const sendAgain = useCallback(
    (user: User) => {
      setNotice(null);
      setFailure(null);
      setInvited(null);
      sendInvitation.mutate(user.id, {
        onSuccess: (updated) => setInvited(updated),
        onError: (error) => setFailure(error.message),
      });
    },
    [sendInvitation],
  );
  const startWithdrawing = useCallback(
    (user: User) => {
      withdrawInvitation.reset();
      setWithdrawing(user);
    },
    [withdrawInvitation],
  );
  const withdraw = () => {
    if (!withdrawing) return;
    withdrawInvitation.mutate(
      { id: withdrawing.id, changes: { active: false } },
      {
        onSuccess: (updated) => {
          setWithdrawing(null);
          setInvited(null);
          setNotice(`The invitation to ${updated.displayName} is withdrawn; the link in their mail no longer works.`);
        },
      },
    );
  };

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
              setInvited(null);
              setFailure(null);
              setCreating(true);
            }}
          >
            New user
          </Button>
        }
      />
      <AnnouncedAlert tone="success" message={notice} className="mb-4" />
      {invited?.invitation && (
        <Alert tone="success" announce className="mb-4">
          Invitation sent to {invited.displayName} at {invited.email}. The link works once, until{' '}
          <DateTime value={invited.invitation.expiresAt} />; any earlier link no longer works.
        </Alert>
      )}
      <AnnouncedAlert tone="danger" message={failure} className="mb-4" />
      <UsersTable
        users={users}
        currentUserId={currentUserId}
        onEdit={startEditing}
        onSendAgain={sendAgain}
        onWithdraw={startWithdrawing}
        sendingId={sendInvitation.isPending ? (sendInvitation.variables ?? null) : null}
      />
      <ConfirmDialog
        open={withdrawing !== null}
        title={`Withdraw the invitation to ${withdrawing?.displayName ?? ''}?`}
        confirmLabel="Withdraw invitation"
        pending={withdrawInvitation.isPending}
        error={withdrawInvitation.error?.message}
        onConfirm={withdraw}
        onCancel={() => setWithdrawing(null)}
      >
        <p>
          The link in their mail stops working at once and the account is deactivated. To invite them later, reactivate
          the account and send the invitation again.
        </p>
      </ConfirmDialog>

      <CreateUserDialog
        open={creating}
        onClose={() => setCreating(false)}
        onCreated={(user) => {
          setCreating(false);
          setFailure(null);
          if (user.invitation) {
            setNotice(null);
            setInvited(user);
          } else {
            setInvited(null);
            setNotice(`${user.displayName} can now sign in with ${user.email} as ${roleLabels[user.role]}.`);
          }
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
