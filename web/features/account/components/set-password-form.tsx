import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { newPasswordSchema, type SetupLinkInfo } from '@shared/schemas/accounts';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useSetPassword } from '../api/set-password';
import { PasswordRules } from './password-rules';

const formSchema = z
  .object({ password: newPasswordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], error: 'The two passwords are not the same' });

/** The person's own password, from their set-up link; on success they go on to sign in. */
export function SetPasswordForm({ token, info, onDone }: { token: string; info: SetupLinkInfo; onDone: (email: string) => void }) {
  const setPassword = useSetPassword();
  const form = useForm({ resolver: zodResolver(formSchema), defaultValues: { password: '', confirm: '' } });
  const { register, formState: { errors } } = form;

  const onSubmit = form.handleSubmit(({ password }) =>
    setPassword.mutate({ token, password }, {
      onSuccess: (result) => onDone(result.email),
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, form.setError, ['password'] as const);
        if (leftover.length) form.setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );
  const problem = formProblem(errors.root?.server?.message, setPassword);

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Choose your password" className="flex flex-col gap-4">
      <p className="text-ink-900">
        Hello {info.name}. Choose the password for <strong className="break-all">{info.email}</strong> ({info.programmeName}).
      </p>
      {problem && <Alert>{problem}</Alert>}
      {/* The e-mail as a hidden username lets a password manager save the pair. */}
      <input type="email" autoComplete="username" value={info.email} readOnly hidden />
      <TextField label="New password" type="password" autoComplete="new-password" error={errors.password?.message} {...register('password')} />
      <TextField label="The same password again" type="password" autoComplete="new-password" error={errors.confirm?.message} {...register('confirm')} />
      <PasswordRules />
      <Button type="submit" size="lg" disabled={setPassword.isPending}>
        {setPassword.isPending ? 'Saving…' : 'Save my password'}
      </Button>
    </form>
  );
}
