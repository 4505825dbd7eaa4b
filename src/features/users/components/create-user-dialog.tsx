import { useState } from 'react';
import { PasswordField } from '../../../components/ui/password-field';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { roleGuides } from '../../../lib/role-guide';
import { useZodForm } from '../../../lib/use-zod-form';
import { PASSWORD_MIN } from '../../../../shared/schemas/auth';
import { createUserRequestSchema, INVITATION_HOURS, type User } from '../../../../shared/schemas/users';
import type { Role } from '../../../../shared/schemas/common';
import { useCreateUser } from '../api/create-user';
import { roleOptions } from './role-options';
import { FormDialog, type CreateDialogProps } from '../../../components/ui/form-dialog';
import { RadioGroup, type RadioChoice } from '../../../components/ui/radio-group';

export type CreateUserDialogProps = CreateDialogProps<User>;

type Start = 'invite' | 'password';
const startOptions: RadioChoice<Start>[] = [
  [
    'invite',
    'Send an invitation',
    `They get a mail with a link to choose their own password; it works once, for ${INVITATION_HOURS} hours.`,
  ],
  ['password', 'Set a first password', 'You hand the password over in person; they can change it under Account.'],
];

const emptyForm = { displayName: '', email: '', role: '', password: '' };

export function CreateUserDialog({ open, onClose, onCreated }: CreateUserDialogProps) {
  const createUser = useCreateUser();
  const [start, setStart] = useState<Start>('invite');
  const form = useZodForm({
    schema: createUserRequestSchema,
    initialValues: emptyForm,
    labels: { displayName: 'Name', email: 'E-mail', role: 'Role', password: 'First password' },
    messages: { role: 'Choose a role.' },
    // An invitation sends no password: the person chooses their own.
    toRequest: ({ password, ...rest }) => ({
      request: start === 'password' ? { ...rest, password } : rest,
      errors: {},
    }),
  });
  const chosenRole = form.values.role as Role | '';

  return (
    <FormDialog
      open={open}
      onClose={onClose}
      title="New user"
      description="Invite a colleague by mail, or give them a first password yourself."
      submitLabel={start === 'invite' ? 'Send invitation' : 'Create account'}
      {...form.dialogSubmit(
        createUser,
        onCreated,
        start === 'invite' ? 'The invitation was not sent' : 'The account was not created',
      )}
    >
      <TextField {...form.field('displayName')} autoComplete="off" description="As colleagues know them." />
      <TextField {...form.field('email')} type="email" autoComplete="off" inputMode="email" />
      <Select
        {...form.field('role')}
        options={roleOptions}
        placeholder="Choose a role…"
        description={chosenRole ? roleGuides[chosenRole].summary : 'The role decides what they can open.'}
      />
      <RadioGroup
        legend="How they get in"
        name="account-start"
        choices={startOptions}
        value={start}
        onChange={setStart}
      />
      {start === 'password' && (
        <PasswordField
          {...form.field('password')}
          autoComplete="new-password"
          description={`At least ${PASSWORD_MIN} characters. Hand it over in person; they can change it under Account.`}
        />
      )}
    </FormDialog>
  );
}
