import { isRouteErrorResponse, Link, useRevalidator, useRouteError } from 'react-router';
import { buttonStyles } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { isApiError } from '../../lib/api-client';
import { paths } from '../../lib/paths';

/** A page that failed to load or render, shown inside the frame with a way to try again. */
export function RouteErrorBoundary() {
  const error = useRouteError();
  const revalidator = useRevalidator();

  if (isRouteErrorResponse(error) && error.status === 404) {
    return (
      <>
        <PageHeader title="Page not found" />
        <ErrorState title="There is no page at this address">
          Check the address, or go back to the dashboard.
        </ErrorState>
      </>
    );
  }

  const forbidden = isApiError(error) && error.status === 403;
  return (
    <>
      <PageHeader title={forbidden ? 'Not for your role' : 'Something went wrong'} />
      <ErrorState
        error={error}
        title={forbidden ? 'Your role cannot open this page' : 'This page could not be shown'}
        onRetry={forbidden ? undefined : () => void revalidator.revalidate()}
        actions={
          <Link to={paths.dashboard} className={buttonStyles('quiet')}>
            Go to the dashboard
          </Link>
        }
      />
    </>
  );
}
