import { useState, type FormEvent } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { PasswordField } from '../../../components/ui/password-field';
import { TextField } from '../../../components/ui/text-field';
import { isApiError } from '../../../lib/api-client';
import { useZodForm } from '../../../lib/use-zod-form';
import { signInRequestSchema, type CurrentUser } from '../../../../shared/schemas/auth';
import { useSignIn } from '../api/sign-in';
import { RetryCountdown } from './retry-countdown';

export interface SignInFormProps {
  onSignedIn: (user: CurrentUser) => void;
}

export function SignInForm({ onSignedIn }: SignInFormProps) {
  const signIn = useSignIn();
  const form = useZodForm({
    schema: signInRequestSchema,
    initialValues: { email: '', password: '' },
    labels: { email: 'E-mail', password: 'Password' },
  });
  const rateLimited = isApiError(signIn.error) && signIn.error.status === 429 ? signIn.error : null;
  // When the lock lifts, set once per answer so the countdown does not restart on re-render.
  const [retryAt, setRetryAt] = useState<number | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const input = form.validate();
    if (!input) return;
    signIn.mutate(input, {
      onSuccess: onSignedIn,
      onError: (error) => {
        const wait = isApiError(error) && error.status === 429 ? error.retryAfterSeconds : null;
        setRetryAt(wait === null ? null : Date.now() + wait * 1000);
        form.fail(error);
      },
    });
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4">
      {rateLimited ? (
        <Alert tone="warning" title="Wait before you try again" announce>
          <p>{rateLimited.message}</p>
          {retryAt !== null && <RetryCountdown key={retryAt} until={retryAt} />}
        </Alert>
      ) : (
        <FormErrorSummary {...form.problems('Sign-in did not work')} />
      )}
      <TextField {...form.field('email')} type="email" autoComplete="username" inputMode="email" autoFocus />
      <PasswordField {...form.field('password')} autoComplete="current-password" />
      <Button type="submit" variant="primary" pending={signIn.isPending} className="w-full">
        Sign in
      </Button>
      <p className="text-[0.8125rem] text-muted">Forgot your password? An admin of your outlet can set a new one.</p>
    </form>
  );
}
