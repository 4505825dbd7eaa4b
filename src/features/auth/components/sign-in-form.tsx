import type { FormEvent } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { PasswordField } from '../../../components/ui/password-field';
import { TextField } from '../../../components/ui/text-field';
import { isApiError } from '../../../lib/api-client';
import { useZodForm } from '../../../lib/use-zod-form';
import { signInRequestSchema, type CurrentUser } from '../../../../shared/schemas/auth';
import { useSignIn } from '../api/sign-in';

export interface SignInFormProps {
  onSignedIn: (user: CurrentUser) => void;
}

function waitMessage(seconds: number): string {
  const minutes = Math.max(1, Math.ceil(seconds / 60));
  const at = new Date(Date.now() + seconds * 1000).toLocaleTimeString(undefined, {
    hour: '2-digit',
    minute: '2-digit',
  });
  return `You can try again in about ${minutes} minute${minutes === 1 ? '' : 's'} (at ${at}).`;
}

export function SignInForm({ onSignedIn }: SignInFormProps) {
  const signIn = useSignIn();
  const form = useZodForm({
    schema: signInRequestSchema,
    initialValues: { email: '', password: '' },
    labels: { email: 'E-mail', password: 'Password' },
  });
  const rateLimited = isApiError(signIn.error) && signIn.error.status === 429 ? signIn.error : null;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const input = form.validate();
    if (!input) return;
    signIn.mutate(input, { onSuccess: onSignedIn, onError: (error) => form.fail(error) });
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4">
      {rateLimited ? (
        <Alert tone="warning" title="Wait before you try again" announce>
          <p>{rateLimited.message}</p>
          {rateLimited.retryAfterSeconds !== null && (
            <p className="mt-1">{waitMessage(rateLimited.retryAfterSeconds)}</p>
          )}
        </Alert>
      ) : (
        <FormErrorSummary
          title="Sign-in did not work"
          items={form.summaryItems}
          message={form.formError}
          attempt={form.attempt}
        />
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
