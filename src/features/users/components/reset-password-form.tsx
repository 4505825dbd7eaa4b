import { useState } from 'react';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { NewPasswordFields } from '../../../components/ui/new-password-fields';
import { useZodForm } from '../../../lib/use-zod-form';
import { PASSWORD_MIN } from '../../../../shared/schemas/auth';
import { updateUserRequestSchema } from '../../../../shared/schemas/users';
import { useUpdateUser } from '../api/update-user';
import { SubmitRow } from '../../../components/ui/submit-row';
import type { UserSectionProps } from './user-section';

export type ResetPasswordFormProps = UserSectionProps;

const passwordOnly = updateUserRequestSchema.pick({ password: true }).required();

export function ResetPasswordForm({ user, isSelf, onSaved }: ResetPasswordFormProps) {
  const updateUser = useUpdateUser();
  const [done, setDone] = useState<string | null>(null);
  const form = useZodForm({
    schema: passwordOnly,
    initialValues: { password: '' },
    labels: { password: 'New password' },
  });

  const submit = form.handleSubmit(
    (input) =>
      updateUser.mutate(
        { id: user.id, changes: { password: input.password } },
        {
          onSuccess: (updated) => {
            form.reset();
            setDone(
              `Password set. ${updated.displayName} has been signed out everywhere; give them the new one in person.`,
            );
            onSaved(updated);
          },
          onError: form.fail,
        },
      ),
    () => setDone(null),
  );

  return (
    <form noValidate onSubmit={submit} className="space-y-3">
      <FormErrorSummary {...form.problems('The password was not set')} />
      <NewPasswordFields
        username={user.email}
        password={form.field('password')}
        description={
          isSelf
            ? `At least ${PASSWORD_MIN} characters. This signs you out too; change your own password under Account instead.`
            : `At least ${PASSWORD_MIN} characters. Setting it signs ${user.displayName} out on every device at once.`
        }
      />
      <SubmitRow label="Set new password" pending={updateUser.isPending} done={done} variant="secondary" />
    </form>
  );
}
