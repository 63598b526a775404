import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signInSchema } from '@shared/schemas/session';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { detailMessages, errorMessage, isApiError } from '../../../lib/api-error';
import { useSignIn } from '../api/sign-in';

const GENERIC_FAILURE = 'That e-mail and password do not match an active account.';

function failureText(error: unknown): string {
  // One message whatever the cause, so the form never reveals which accounts exist.
  if (isApiError(error) && error.code === 'invalid_credentials') return error.message || GENERIC_FAILURE;
  return errorMessage(error);
}

/** On success the sign-in route sees the new session and moves on; the form only collects and reports. */
export function SignInForm() {
  const signIn = useSignIn();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, submitCount },
  } = useForm({ resolver: zodResolver(signInSchema), defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit((values) =>
    signIn.mutate(values, {
      onError: (error) => {
        if (!isApiError(error) || error.code !== 'validation_failed') return;
        for (const field of ['email', 'password'] as const) {
          const message = detailMessages(error.details?.[field])[0];
          if (message) setError(field, { type: 'server', message });
        }
      },
    }),
  );

  const showAlert = signIn.isError && !(isApiError(signIn.error) && signIn.error.code === 'validation_failed');

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <ErrorSummary attempt={submitCount} failure={signIn.error} problem={showAlert ? failureText(signIn.error) : undefined} />
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        inputMode="email"
        error={errors.email?.message}
        {...register('email')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" size="lg" disabled={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
