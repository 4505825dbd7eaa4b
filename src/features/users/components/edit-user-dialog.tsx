import type { ComponentType } from 'react';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import type { User } from '../../../../shared/schemas/users';
import { AccountAccess } from './account-access';
import { ResetPasswordForm } from './reset-password-form';
import { UserDetailsForm } from './user-details-form';
import type { UserSectionProps } from './user-section';

export interface EditUserDialogProps {
  /** The account being edited; kept while the dialog closes so its content does not vanish mid-animation. */
  user: User | null;
  open: boolean;
  isSelf: boolean;
  onClose: () => void;
  onSaved: (user: User) => void;
}

/** The editor's parts, in the order they are shown. */
const sections: readonly (readonly [string, ComponentType<UserSectionProps>])[] = [
  ['Details', UserDetailsForm],
  ['Password', ResetPasswordForm],
  ['Access', AccountAccess],
];

export function EditUserDialog({ user, open, isSelf, onClose, onSaved }: EditUserDialogProps) {
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title={user ? `Edit ${user.displayName}` : 'Edit user'}
      description={user?.email}
      size="md"
      footer={<Button onClick={onClose}>Close</Button>}
    >
      {user && (
        // Keyed by account, so switching to another user starts from that user's values.
        <div key={user.id} className="divide-y divide-rule">
          {sections.map(([title, Part]) => (
            <section key={title} className="py-4 first:pt-0 last:pb-0">
              <h3 className="mb-3 font-mono text-xs font-semibold tracking-wide text-muted uppercase">{title}</h3>
              <Part user={user} isSelf={isSelf} onSaved={onSaved} />
            </section>
          ))}
        </div>
      )}
    </Dialog>
  );
}
