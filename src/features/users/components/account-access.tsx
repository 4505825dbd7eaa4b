import { useState } from 'react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { useUpdateUser } from '../api/update-user';
import type { UserSectionProps } from './user-section';

export type AccountAccessProps = UserSectionProps;

/** Deactivate or reactivate, always through a confirmation that says what happens to the person's sessions. */
export function AccountAccess({ user, isSelf, onSaved }: AccountAccessProps) {
  const updateUser = useUpdateUser();
  const [confirming, setConfirming] = useState(false);
  const deactivating = user.active;

  const confirm = () =>
    updateUser.mutate(
      { id: user.id, changes: { active: !user.active } },
      {
        onSuccess: (updated) => {
          setConfirming(false);
          onSaved(updated);
        },
      },
    );

  return (
    <div className="flex flex-wrap items-center justify-between gap-3">
      <div className="text-sm">
        <p className="flex items-center gap-2">
          {!user.active ? (
            <Badge tone="muted">Deactivated</Badge>
          ) : user.passwordSet ? (
            <Badge tone="positive">Active</Badge>
          ) : (
            <Badge tone="caution">Invited</Badge>
          )}
          <span>
            {!user.active
              ? 'Cannot sign in.'
              : user.passwordSet
                ? 'Can sign in.'
                : 'Cannot sign in until they set a password from their invitation.'}
          </span>
        </p>
        {isSelf && <p className="mt-1 text-muted">You cannot deactivate your own account.</p>}
      </div>
      {!isSelf && (
        <Button
          variant={deactivating ? 'danger' : 'secondary'}
          onClick={() => {
            updateUser.reset();
            setConfirming(true);
          }}
        >
          {deactivating ? 'Deactivate account' : 'Reactivate account'}
        </Button>
      )}

      <ConfirmDialog
        open={confirming}
        title={deactivating ? `Deactivate ${user.displayName}?` : `Reactivate ${user.displayName}?`}
        confirmLabel={deactivating ? 'Deactivate' : 'Reactivate'}
        tone={deactivating ? 'danger' : 'primary'}
        pending={updateUser.isPending}
        error={updateUser.error?.message}
        onConfirm={confirm}
        onCancel={() => setConfirming(false)}
      >
        {deactivating ? (
          <>
            <p>
              {user.displayName} is signed out <strong>at once, on every device</strong>, and cannot sign in again until
              an admin reactivates the account.
            </p>
            <p className="text-muted">Their work in Benchwire stays as it is. You can reactivate the account later.</p>
          </>
        ) : (
          <>
            {user.passwordSet ? (
              <>
                <p>{user.displayName} can sign in again with their current password.</p>
                <p className="text-muted">If they no longer have it, set a new password after reactivating.</p>
              </>
            ) : (
              <p>
                {user.displayName} has never set a password: after reactivating, send the invitation again from the
                users table, or set a first password here.
              </p>
            )}
          </>
        )}
      </ConfirmDialog>
    </div>
  );
}
