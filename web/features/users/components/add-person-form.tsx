import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { ROLES, ROLE_LABELS } from '@shared/auth/roles';
import { createUserSchema, type CreateUserInput } from '@shared/schemas/users';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { SelectField, TextField } from '../../../components/ui/field';
import { FormActions } from '../../../components/ui/form-actions';
import { errorMessage, isApiError } from '../../../lib/api-error';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import type { useCreateUser } from '../api/create-user';

const FIELDS = ['email', 'name', 'role'] as const;

interface AddPersonFormProps {
  mutation: ReturnType<typeof useCreateUser>;
  onCancel: () => void;
}

export function AddPersonForm({ mutation, onCancel }: AddPersonFormProps) {
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, submitCount },
  } = useForm({
    resolver: zodResolver(createUserSchema),
    defaultValues: { name: '', email: '', role: '' as CreateUserInput['role'] },
  });

  const onSubmit = handleSubmit((values) =>
    mutation.mutate(values, {
      onError: (error) => {
        if (isApiError(error) && error.code === 'conflict') {
          setError('email', { type: 'server', message: error.message });
          return;
        }
        const leftover = applyServerFieldErrors(error, setError, FIELDS);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );

  // Field-level problems are shown beside the fields; anything else (e.g. a lost connection) above the form.
  const handledInline = isApiError(mutation.error) && ['conflict', 'validation_failed'].includes(mutation.error.code);
  const formProblem = errors.root?.server?.message ?? (mutation.isError && !handledInline ? errorMessage(mutation.error) : undefined);

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <ErrorSummary attempt={submitCount} failure={mutation.error} problem={formProblem} />
      <div className="grid gap-4 md:grid-cols-3">
        <TextField label="Full name" autoComplete="off" error={errors.name?.message} {...register('name')} />
        <TextField label="E-mail" type="email" autoComplete="off" error={errors.email?.message} {...register('email')} />
        <SelectField label="Role" error={errors.role?.message} {...register('role')}>
          <option value="">Select a role</option>
          {ROLES.map((role) => (
            <option key={role} value={role}>
              {ROLE_LABELS[role]}
            </option>
          ))}
        </SelectField>
      </div>
      <FormActions pending={mutation.isPending} submitLabel="Send invitation" pendingLabel="Sending…" onCancel={onCancel} />
    </form>
  );
}
