import { PasswordField } from '../../../components/ui/password-field';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { roleGuides } from '../../../lib/role-guide';
import { useZodForm } from '../../../lib/use-zod-form';
import { PASSWORD_MIN } from '../../../../shared/schemas/auth';
import { createUserRequestSchema, type User } from '../../../../shared/schemas/users';
import type { Role } from '../../../../shared/schemas/common';
import { useCreateUser } from '../api/create-user';
import { roleOptions } from './role-options';
import { FormDialog } from '../../../components/ui/form-dialog';

export interface CreateUserDialogProps {
  open: boolean;
  onClose: () => void;
  onCreated: (user: User) => void;
}

const emptyForm = { displayName: '', email: '', role: '', password: '' };

export function CreateUserDialog({ open, onClose, onCreated }: CreateUserDialogProps) {
  const createUser = useCreateUser();
  const form = useZodForm({
    schema: createUserRequestSchema,
    initialValues: emptyForm,
    labels: { displayName: 'Name', email: 'E-mail', role: 'Role', password: 'First password' },
    messages: { role: 'Choose a role.' },
  });
  const chosenRole = form.values.role as Role | '';

  return (
    <FormDialog
      open={open}
      onClose={onClose}
      title="New user"
      description="The account can sign in as soon as it is created."
      submitLabel="Create account"
      pending={createUser.isPending}
      onSubmit={() => form.submitWith(createUser, onCreated)}
      problems={form.problems('The account was not created')}
    >
      <TextField {...form.field('displayName')} autoComplete="off" description="As colleagues know them." />
      <TextField {...form.field('email')} type="email" autoComplete="off" inputMode="email" />
      <Select
        {...form.field('role')}
        options={roleOptions}
        placeholder="Choose a role…"
        description={chosenRole ? roleGuides[chosenRole].summary : 'The role decides what they can open.'}
      />
      <PasswordField
        {...form.field('password')}
        autoComplete="new-password"
        description={`At least ${PASSWORD_MIN} characters. Hand it over in person; they can change it under Account.`}
      />
    </FormDialog>
  );
}
