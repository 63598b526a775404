import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { TextField } from '../../../components/ui/field';
import { SavedNote } from '../../../components/ui/saved-note';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useEmailDischargeLetter } from '../api/email-discharge-letter';

/** The discharge letter for the family doctor and the community team: a download link and an e-mail form. */
export function DischargeLetterActions({ infantId, canSend }: { infantId: string; canSend: boolean }) {
  const email = useEmailDischargeLetter(infantId);
  const form = useForm<{ to: string }>({ defaultValues: { to: '' } });
  const { register, formState: { errors, submitCount }, setError } = form;
  const onSubmit = form.handleSubmit((v) =>
    email.mutate(v, {
      onSuccess: () => form.reset(),
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, ['to']);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );
  return (
    <div className="flex flex-col gap-3">
      <h3 className="font-bold text-ink-900">Discharge letter</h3>
      <p>
        <a className="font-semibold text-brand-800 underline" href={`/api/infants/${encodeURIComponent(infantId)}/discharge-letter.pdf`} download>
          Download the discharge letter (PDF)
        </a>
        <span className="text-sm text-ink-700"> for the family doctor and the community team; written from the approved setting.</span>
      </p>
      {canSend && (
        <form onSubmit={onSubmit} noValidate aria-label="E-mail the discharge letter" className="flex flex-col gap-2">
          <ErrorSummary attempt={submitCount} failure={email.error} problem={formProblem(errors.root?.server?.message, email)} />
          <TextField label="E-mail the letter to" type="email" autoComplete="off" hint="The surgery's or community team's address"
            error={errors.to?.message} {...register('to')} />
          <div><Button type="submit" variant="secondary" disabled={email.isPending}>{email.isPending ? 'Sending…' : 'E-mail the letter'}</Button></div>
          {email.isSuccess && <SavedNote key={email.submittedAt}>Letter sent to {email.data.sentTo}.</SavedNote>}
        </form>
      )}
    </div>
  );
}
