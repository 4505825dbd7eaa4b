import type { User } from '../../../../shared/schemas/users';

/** What each part of the user editor (details, password, access) takes. */
export interface UserSectionProps {
  user: User;
  /** The admin is editing their own account. */
  isSelf: boolean;
  onSaved: (user: User) => void;
}
