import { useRouteError } from 'react-router';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { ErrorState } from '../../components/ui/error-state';

/** The last resort, when even the frame could not be shown (e.g. the server is down at the first visit). */
export function RootErrorBoundary() {
  const error = useRouteError();
  return (
    <AuthLayout>
      <title>Benchwire is not available</title>
      <ErrorState error={error} title="Benchwire could not start" onRetry={() => window.location.reload()} />
    </AuthLayout>
  );
}
