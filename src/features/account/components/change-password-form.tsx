import { useState, type FormEvent } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Panel } from '../../../components/ui/panel';
import { NewPasswordFields } from '../../../components/ui/new-password-fields';
import { useZodForm } from '../../../lib/use-zod-form';
import { changePasswordRequestSchema } from '../../../../shared/schemas/auth';
import { useChangePassword } from '../api/change-password';

const emptyForm = { currentPassword: '', newPassword: '', confirmPassword: '' };

export interface ChangePasswordFormProps {
  /** The signed-in user's e-mail, so password managers file the new password under the right account. */
  email: string;
}

export function ChangePasswordForm({ email }: ChangePasswordFormProps) {
  const changePassword = useChangePassword();
  const [changed, setChanged] = useState(false);
  const form = useZodForm({
    schema: changePasswordRequestSchema,
    initialValues: emptyForm,
    labels: { currentPassword: 'Current password', newPassword: 'New password', confirmPassword: 'New password again' },
  });

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setChanged(false);
    const input = form.validate();
    if (!input) return;
    changePassword.mutate(input, {
      onSuccess: () => {
        form.reset();
        setChanged(true);
      },
      onError: (error) => form.fail(error),
    });
  };

  return (
    <Panel title="Change password" description="Changing it signs you out on every other device.">
      <form noValidate onSubmit={submit} className="max-w-md space-y-4">
        {changed && (
          <Alert tone="success" announce>
            Your password is changed. Your other sessions have ended; this one stays signed in.
          </Alert>
        )}
        <FormErrorSummary {...form.problems('The password was not changed')} />
        <NewPasswordFields
          username={email}
          current={form.field('currentPassword')}
          password={form.field('newPassword')}
          confirm={form.field('confirmPassword')}
        />
        <Button type="submit" variant="primary" pending={changePassword.isPending}>
          Change password
        </Button>
      </form>
    </Panel>
  );
}
