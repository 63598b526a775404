import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { changePasswordSchema, type ChangePasswordInput } from '@shared/schemas/accounts';
import { Alert } from '../../../components/ui/alert';
import { TextField } from '../../../components/ui/field';
import { FormActions } from '../../../components/ui/form-actions';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useChangePassword } from '../api/change-password';
import { PasswordRules } from './password-rules';

const formSchema = changePasswordSchema
  .extend({ confirm: z.string() })
  .refine((v) => v.newPassword === v.confirm, { path: ['confirm'], error: 'The two new passwords are not the same' });
const EMPTY = { currentPassword: '', newPassword: '', confirm: '' };

export function ChangePasswordForm({ onCancel }: { onCancel: () => void }) {
  const change = useChangePassword();
  const form = useForm({ resolver: zodResolver(formSchema), defaultValues: EMPTY });
  const { register, formState: { errors } } = form;

  const onSubmit = form.handleSubmit(({ currentPassword, newPassword }: ChangePasswordInput) =>
    change.mutate({ currentPassword, newPassword }, {
      onSuccess: () => form.reset(EMPTY),
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, form.setError, ['currentPassword', 'newPassword'] as const);
        if (leftover.length) form.setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );
  const problem = formProblem(errors.root?.server?.message, change);

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Change my password" className="flex max-w-md flex-col gap-4">
      {problem && <Alert>{problem}</Alert>}
      <TextField label="Current password" type="password" autoComplete="current-password" error={errors.currentPassword?.message} {...register('currentPassword')} />
      <TextField label="New password" type="password" autoComplete="new-password" error={errors.newPassword?.message} {...register('newPassword')} />
      <TextField label="The new password again" type="password" autoComplete="new-password" error={errors.confirm?.message} {...register('confirm')} />
      <PasswordRules />
      <FormActions pending={change.isPending} submitLabel="Change password" pendingLabel="Saving…" onCancel={onCancel} />
    </form>
  );
}
