import { isRouteErrorResponse, Link, useLocation, useRevalidator, useRouteError } from 'react-router';
import { buttonStyles } from '../../components/ui/button';
import { describeError, ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';

/** The list a page belongs to, so a missing record offers the way back to it. */
const sections: ReadonlyArray<{ path: string; thing: string; list: string }> = [
  { path: paths.catalog, thing: 'product', list: 'the catalog' },
  { path: paths.roundups, thing: 'roundup', list: 'the roundups' },
  { path: paths.benches, thing: 'bench', list: 'the benches' },
  { path: paths.users, thing: 'person', list: 'the people' },
];

function sectionOf(pathname: string) {
  return sections.find((section) => pathname === section.path || pathname.startsWith(`${section.path}/`));
}

/** A page that failed to load or render, shown inside the frame with the action that can help. */
export function RouteErrorBoundary() {
  const error = useRouteError();
  const revalidator = useRevalidator();
  const { pathname } = useLocation();
  const section = sectionOf(pathname);
  const dashboardLink = (
    <Link to={paths.dashboard} className={buttonStyles(section ? 'quiet' : 'secondary')}>
      Go to the dashboard
    </Link>
  );
  const backLink = section && (
    <Link to={section.path} className={buttonStyles('secondary')}>
      Back to {section.list}
    </Link>
  );

  if (isRouteErrorResponse(error) && error.status === 404) {
    return (
      <>
        <PageHeader title="Page not found" />
        <ErrorState
          title="There is no page at this address"
          actions={
            <>
              {backLink}
              {dashboardLink}
            </>
          }
        >
          Check the address, or go back to where you came from.
        </ErrorState>
      </>
    );
  }

  const { kind } = describeError(error);
  const missing = kind === 'missing';
  const forbidden = kind === 'forbidden';
  return (
    <>
      <PageHeader title={forbidden ? 'Not for your role' : missing ? 'Not found' : 'Something went wrong'} />
      <ErrorState
        error={error}
        title={
          forbidden
            ? 'Your role cannot open this page'
            : missing
              ? `This ${section?.thing ?? 'page'} does not exist`
              : 'This page could not be shown'
        }
        onRetry={() => void revalidator.revalidate()}
        actions={
          <>
            {backLink}
            {dashboardLink}
          </>
        }
      />
    </>
  );
}
