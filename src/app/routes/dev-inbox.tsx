import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { devInboxQueryOptions } from '../../features/mail/api/get-dev-inbox';
import { DevInbox } from '../../features/mail/components/dev-inbox';
import { gatedPage, pageLoader } from '../page-route';

export const loader = pageLoader(paths.devInbox, (queryClient) => queryClient.ensureQueryData(devInboxQueryOptions()));

export const Component = gatedPage({ path: paths.devInbox, pageName: 'Dev inbox' }, DevInboxPage);

function DevInboxPage() {
  return (
    <>
      <PageHeader
        title="Dev inbox"
        description="What the local mail relay received. Nothing here reaches a real mailbox."
      />
      <DevInbox />
    </>
  );
}
