import { PASSWORD_MIN } from '../../../shared/schemas/auth';
import { PasswordField, type PasswordFieldProps } from './password-field';

export interface NewPasswordFieldsProps {
  /** The account's e-mail, so password managers file the new password under the right account. */
  username: string;
  /** The password in use now, where the form asks for it first. */
  current?: PasswordFieldProps;
  /** The new password. */
  password: PasswordFieldProps;
  /** The new password typed again, where the form asks for it twice. */
  confirm?: PasswordFieldProps;
  description?: string;
}

/** The fields that set a password: the hidden account name, the new password and, where asked, the same again. */
export function NewPasswordFields({
  username,
  current,
  password,
  confirm,
  description = `At least ${PASSWORD_MIN} characters. A few unrelated words make a strong one.`,
}: NewPasswordFieldsProps) {
  return (
    <>
      <input type="text" name="username" autoComplete="username" value={username} readOnly hidden />
      {current && <PasswordField {...current} autoComplete="current-password" />}
      <PasswordField {...password} autoComplete="new-password" description={description} />
      {confirm && <PasswordField {...confirm} autoComplete="new-password" />}
    </>
  );
}
