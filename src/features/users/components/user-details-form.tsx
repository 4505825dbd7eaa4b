import { useState, type FormEvent } from 'react';
import { Alert } from '../../../components/ui/alert';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { useZodForm } from '../../../lib/use-zod-form';
import { roleLabels } from '../../../../shared/schemas/common';
import { updateUserRequestSchema, type UpdateUserRequest } from '../../../../shared/schemas/users';
import { useUpdateUser } from '../api/update-user';
import { roleOptions } from './role-options';
import { SubmitRow } from '../../../components/ui/submit-row';
import type { UserSectionProps } from './user-section';

export type UserDetailsFormProps = UserSectionProps;

/** Name, e-mail and role; sends only what changed, so an unchanged role never ends anyone's sessions. */
export function UserDetailsForm({ user, isSelf, onSaved }: UserDetailsFormProps) {
  const updateUser = useUpdateUser();
  const [saved, setSaved] = useState<string | null>(null);
  const form = useZodForm({
    schema: updateUserRequestSchema,
    initialValues: { displayName: user.displayName, email: user.email, role: user.role as string },
    labels: { displayName: 'Name', email: 'E-mail', role: 'Role' },
    messages: { role: 'Choose a role.' },
  });
  const roleChanges = form.values.role !== user.role;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setSaved(null);
    const input = form.validate();
    if (!input) return;
    const changes: UpdateUserRequest = {};
    if (input.displayName !== undefined && input.displayName !== user.displayName)
      changes.displayName = input.displayName;
    if (input.email !== undefined && input.email !== user.email) changes.email = input.email;
    if (input.role !== undefined && input.role !== user.role) changes.role = input.role;
    if (Object.keys(changes).length === 0) {
      setSaved('Nothing changed, so nothing was saved.');
      return;
    }
    updateUser.mutate(
      { id: user.id, changes },
      {
        onSuccess: (updated) => {
          setSaved(changes.role ? `Saved. ${updated.displayName} has been signed out everywhere.` : 'Saved.');
          onSaved(updated);
        },
        onError: (error) => form.fail(error),
      },
    );
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4">
      <FormErrorSummary {...form.problems('The changes were not saved')} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField {...form.field('displayName')} autoComplete="off" />
        <TextField {...form.field('email')} type="email" autoComplete="off" inputMode="email" />
      </div>
      <Select
        {...form.field('role')}
        options={roleOptions}
        disabled={isSelf}
        description={isSelf ? 'You cannot remove your own admin role; another admin can.' : undefined}
        className="sm:w-1/2 sm:pr-2"
      />
      {roleChanges && (
        <Alert tone="warning">
          Changing the role from {roleLabels[user.role]} signs {user.displayName} out on every device at once.
        </Alert>
      )}
      <SubmitRow label="Save changes" pending={updateUser.isPending} done={saved} />
    </form>
  );
}
