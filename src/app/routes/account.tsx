import { PageHeader } from '../../components/ui/page-header';
import { sessionsQueryOptions } from '../../features/account/api/get-sessions';
import { AccountDetails } from '../../features/account/components/account-details';
import { ChangePasswordForm } from '../../features/account/components/change-password-form';
import { SessionsPanel } from '../../features/account/components/sessions-panel';
import { calendarFeedQueryOptions } from '../../features/bench-booking/api/calendar-feed';
import { CalendarFeedPanel } from '../../features/bench-booking/components/calendar-feed-panel';
import { bookers, may } from '../../../shared/access/roles';
import { MailPreferencesPanel } from '../../features/mail/components/mail-preferences-panel';
import { paths } from '../../lib/paths';
import type { CurrentUser } from '../../../shared/schemas/auth';
import { gatedPage, pageLoader } from '../page-route';

export const loader = pageLoader(paths.account, (queryClient, _args, user) =>
  Promise.all([
    queryClient.ensureQueryData(sessionsQueryOptions()),
    // Bench testers have a private calendar of their bookings.
    may(user.role, bookers) ? queryClient.ensureQueryData(calendarFeedQueryOptions()) : null,
  ]),
);

export const Component = gatedPage({ path: paths.account, pageName: 'Account' }, AccountPage);

function AccountPage({ user }: { user: CurrentUser }) {
  return (
    <>
      <PageHeader title="Account" description="Your own details, password and signed-in devices." />
      <div className="grid grid-cols-1 gap-5 lg:grid-cols-2">
        <AccountDetails user={user} />
        <ChangePasswordForm email={user.email} />
        <SessionsPanel className="lg:col-span-2" />
        {may(user.role, bookers) && <CalendarFeedPanel className="lg:col-span-2" />}
        <MailPreferencesPanel className="lg:col-span-2" />
      </div>
    </>
  );
}
