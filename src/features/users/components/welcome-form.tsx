import type { FormEvent } from 'react';
import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { DateTime } from '../../../components/ui/date-time';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { LoadingState } from '../../../components/ui/loading-state';
import { NewPasswordFields } from '../../../components/ui/new-password-fields';
import { isApiError } from '../../../lib/api-client';
import { useZodForm } from '../../../lib/use-zod-form';
import { roleGuides } from '../../../lib/role-guide';
import type { CurrentUser } from '../../../../shared/schemas/auth';
import { roleLabels } from '../../../../shared/schemas/common';
import { acceptInvitationRequestSchema } from '../../../../shared/schemas/users';
import { useAcceptInvitation, useInvitation } from '../api/invitation';

export interface WelcomeFormProps {
  token: string;
  onAccepted: (user: CurrentUser) => void;
}

/** Why a link cannot be used, in words; every case ends with what to do next. */
function LinkRefused({ error }: { error: unknown }) {
  const known =
    isApiError(error) && ['invitation_unknown', 'invitation_used', 'invitation_expired'].includes(error.code);
  const title =
    isApiError(error) && error.code === 'invitation_used'
      ? 'This invitation has been used'
      : isApiError(error) && error.code === 'invitation_expired'
        ? 'This invitation has expired'
        : isApiError(error) && error.status === 429
          ? 'Wait before you try again'
          : 'This invitation link does not work';
  return (
    <>
      <h1 className="mb-3 text-xl font-semibold">{title}</h1>
      <Alert tone="warning" announce>
        <p>
          {known || (isApiError(error) && error.status === 429)
            ? (error as Error).message
            : 'The link may be incomplete: open it straight from the mail, or ask an admin at your outlet to send you a new invitation.'}
        </p>
      </Alert>
      <p className="mt-4 text-sm">
        Already have a password? <Link to="/sign-in">Sign in</Link>.
      </p>
    </>
  );
}

/** The welcome page's content: who is invited, and the new password typed twice. */
export function WelcomeForm({ token, onAccepted }: WelcomeFormProps) {
  const invitation = useInvitation(token);
  const accept = useAcceptInvitation();
  const form = useZodForm({
    schema: acceptInvitationRequestSchema,
    initialValues: { newPassword: '', confirmPassword: '' },
    labels: { newPassword: 'New password', confirmPassword: 'New password again' },
  });

  if (invitation.isPending) return <LoadingState label="Opening your invitation…" />;
  if (invitation.isError) return <LinkRefused error={invitation.error} />;
  const invited = invitation.data;
  // The link stopped working while the page was open (used in another tab, withdrawn, expired).
  const linkGone =
    isApiError(accept.error) &&
    ['invitation_unknown', 'invitation_used', 'invitation_expired'].includes(accept.error.code);
  if (linkGone) return <LinkRefused error={accept.error} />;
  const rateLimited = isApiError(accept.error) && accept.error.status === 429 ? accept.error : null;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const input = form.validate();
    if (!input) return;
    accept.mutate(
      { token, input },
      {
        onSuccess: onAccepted,
        onError: (error) => form.fail(error),
      },
    );
  };

  return (
    <>
      <h1 className="mb-1 text-xl font-semibold">Welcome, {invited.displayName}</h1>
      <p className="mb-4 text-sm text-muted">
        You are invited to Benchwire as <strong className="font-semibold text-ink">{roleLabels[invited.role]}</strong>.{' '}
        {roleGuides[invited.role].summary}
      </p>
      <dl className="mb-5 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        <dt className="text-muted">Your e-mail</dt>
        <dd className="break-all">{invited.email}</dd>
        <dt className="text-muted">Link works until</dt>
        <dd>
          <DateTime value={invited.expiresAt} />
        </dd>
      </dl>
      <form noValidate onSubmit={submit} className="space-y-4">
        {rateLimited ? (
          <Alert tone="warning" title="Wait before you try again" announce>
            <p>{rateLimited.message}</p>
          </Alert>
        ) : (
          <FormErrorSummary {...form.problems('Your password was not set')} />
        )}
        <NewPasswordFields
          username={invited.email}
          password={form.field('newPassword')}
          confirm={form.field('confirmPassword')}
        />
        <Button type="submit" variant="primary" pending={accept.isPending} className="w-full">
          Set password and sign in
        </Button>
      </form>
    </>
  );
}
