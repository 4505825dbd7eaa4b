import { Link, useLocation } from 'react-router';
import { buttonStyles } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';

export function Component() {
  const { pathname } = useLocation();
  return (
    <>
      <PageHeader title="Page not found" eyebrow="404" />
      <EmptyState
        title="There is no page at this address"
        action={
          <Link to={paths.dashboard} className={buttonStyles('primary')}>
            Go to the dashboard
          </Link>
        }
      >
        Nothing in Benchwire lives at <code className="numeric break-all text-ink">{pathname}</code>. The link may be
        old, or the page may come in a later build.
      </EmptyState>
    </>
  );
}
