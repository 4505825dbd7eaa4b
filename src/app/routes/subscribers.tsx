import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { paths } from '../../lib/paths';
import { roundupsQueryOptions, useRoundups } from '../../features/roundups/api/get-roundups';
import { subscriberCategoriesQueryOptions } from '../../features/mail/api/subscribers';
import { RoundupMailPanel } from '../../features/mail/components/roundup-mail-panel';
import { SubscriberCategories } from '../../features/mail/components/subscriber-categories';
import { may, planEditors } from '../../../shared/access/roles';
import type { CurrentUser } from '../../../shared/schemas/auth';
import { gatedPage, pageLoader } from '../page-route';

export const loader = pageLoader(paths.subscribers, (queryClient) =>
  Promise.all([
    queryClient.ensureQueryData(subscriberCategoriesQueryOptions()),
    queryClient.ensureQueryData(roundupsQueryOptions()),
  ]),
);

export const Component = gatedPage({ path: paths.subscribers, pageName: 'Subscribers' }, SubscribersPage);

function SubscribersPage({ user }: { user: CurrentUser }) {
  const roundups = useRoundups();
  const editor = may(user.role, planEditors);
  const mailable = roundups.filter((r) => ['in-review', 'scheduled', 'live', 'updated'].includes(r.state));
  return (
    <>
      <PageHeader
        title="Subscribers"
        description="Readers who asked for mail, the subjects they chose, and each roundup’s mailings."
      />
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
    </>
  );
}
