import { useQueryClient } from '@tanstack/react-query';
import { useNavigate, useParams } from 'react-router';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { sessionKey } from '../../features/auth/api/auth-keys';
import { WelcomeForm } from '../../features/users/components/welcome-form';

/** /welcome/<token>: the link of a staff invitation. Setting the password signs the person in. */
export function Component() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();

  return (
    <AuthLayout>
      <title>Welcome · Benchwire</title>
      <div className="rounded-[3px] border border-rule bg-surface px-5 py-6 shadow-[0_1px_0_var(--color-rule)]">
        <WelcomeForm
          token={token}
          onAccepted={(user) => {
            // Nothing cached for a previous user may leak into this one's screens.
            queryClient.removeQueries();
            queryClient.setQueryData(sessionKey, user);
            void navigate('/', { replace: true });
          }}
        />
      </div>
    </AuthLayout>
  );
}
