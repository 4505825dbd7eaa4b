import type { QueryClient } from '@tanstack/react-query';
import { PageHeader } from '../../components/ui/page-header';
import { useSession } from '../../features/auth/api/get-session';
import { sessionsQueryOptions } from '../../features/account/api/get-sessions';
import { AccountDetails } from '../../features/account/components/account-details';
import { ChangePasswordForm } from '../../features/account/components/change-password-form';
import { SessionsPanel } from '../../features/account/components/sessions-panel';
import { calendarFeedQueryOptions } from '../../features/bench-booking/api/calendar-feed';
import { CalendarFeedPanel } from '../../features/bench-booking/components/calendar-feed-panel';
import { sessionQueryOptions } from '../../features/auth/api/get-session';
import { bookers, may } from '../../../shared/access/roles';
import { MailPreferencesPanel } from '../../features/mail/components/mail-preferences-panel';

export function loader(queryClient: QueryClient) {
  return async () => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    await Promise.all([
      queryClient.ensureQueryData(sessionsQueryOptions()),
      // Bench testers have a private calendar of their bookings.
      user && may(user.role, bookers) ? queryClient.ensureQueryData(calendarFeedQueryOptions()) : null,
    ]);
    return null;
  };
}

export function Component() {
  const user = useSession();
  if (!user) return null;
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
