import { redirect, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import type { QueryClient } from '@tanstack/react-query';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { safeNextPath } from '../../lib/paths';
import { sessionQueryOptions } from '../../features/auth/api/get-session';
import { SignInForm } from '../../features/auth/components/sign-in-form';

/** Someone already signed in has nothing to do here: send them on. */
export function loader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (user) throw redirect(safeNextPath(new URL(request.url).searchParams.get('next')));
    return null;
  };
}

export function Component() {
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const next = safeNextPath(searchParams.get('next'));

  return (
    <AuthLayout>
      <title>Sign in · Benchwire</title>
      <div className="rounded-[3px] border border-rule bg-surface px-5 py-6 shadow-[0_1px_0_var(--color-rule)]">
        <h1 className="mb-1 text-xl font-semibold">Sign in</h1>
        <p className="mb-5 text-sm text-muted">Use the e-mail address and password your outlet’s admin gave you.</p>
        <SignInForm onSignedIn={() => void navigate(next, { replace: true })} />
      </div>
    </AuthLayout>
  );
}
