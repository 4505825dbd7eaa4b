import type { QueryClient } from '@tanstack/react-query';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { roundupsQueryOptions, useRoundups } from '../../features/roundups/api/get-roundups';
import { subscriberCategoriesQueryOptions } from '../../features/mail/api/subscribers';
import { RoundupMailPanel } from '../../features/mail/components/roundup-mail-panel';
import { SubscriberCategories } from '../../features/mail/components/subscriber-categories';
import { may, planEditors } from '../../../shared/access/roles';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';

export function loader(queryClient: QueryClient) {
  return async () => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (user && canOpen(paths.subscribers, user.role)) {
      await Promise.all([
        queryClient.ensureQueryData(subscriberCategoriesQueryOptions()),
        queryClient.ensureQueryData(roundupsQueryOptions()),
      ]);
    }
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.subscribers} pageName="Subscribers">
      <PageHeader
        title="Subscribers"
        description="Readers who asked for mail, the subjects they chose, and each roundup’s mailings."
      />
      <SubscribersPage />
    </RoleGate>
  );
}

function SubscribersPage() {
  const user = useSession();
  const roundups = useRoundups();
  const editor = Boolean(user && may(user.role, planEditors));
  const mailable = roundups.filter((r) => ['in-review', 'scheduled', 'live', 'updated'].includes(r.state));
  return (
    <div className="space-y-5">
      <SubscriberCategories canEdit={editor} />
      {editor && (
        <Panel
          title="Roundup mailings"
          description="A roundup’s go-live mail is queued when it is published; updates and corrections go out only when you choose."
        >
          {mailable.length === 0 ? (
            <p className="text-sm text-muted">No roundup is in review, scheduled or live yet.</p>
          ) : (
            mailable.map((roundup) => <RoundupMailPanel key={roundup.id} roundup={roundup} />)
          )}
        </Panel>
      )}
    </div>
  );
}
