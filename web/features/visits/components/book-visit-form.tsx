import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { bookVisitSchema, VISIT_KIND_LABELS, VISIT_KINDS, type BookVisitInput } from '@shared/schemas/visits';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { CLOCK_HINT, CLOCK_INPUT } from '../../../components/ui/clock-input';
import { SelectField, TextField } from '../../../components/ui/field';
import { FormActions } from '../../../components/ui/form-actions';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { asNumber } from '../../../lib/form-values';
import { useBookVisit } from '../api/book-visit';
import { useVisitStaff } from '../api/get-visit-staff';

type Values = z.input<typeof bookVisitSchema>;
const FIELDS = ['kind', 'date', 'time', 'durationMinutes', 'staffId', 'purpose'] as const;
const DEFAULTS = { kind: 'home_visit', date: '', time: '', durationMinutes: 45, staffId: '', purpose: '' } satisfies Values;

/** `initial` fills boxes ahead (the proposed first visit after discharge: its date and purpose). */
export function BookVisitForm({ infantId, onClose, initial }: { infantId: string; onClose: () => void; initial?: Partial<Values> }) {
  const book = useBookVisit(infantId);
  const team = useVisitStaff();
  const form = useForm<Values, unknown, BookVisitInput>({ resolver: zodResolver(bookVisitSchema), defaultValues: { ...DEFAULTS, ...initial } });
  const { register, formState: { errors, submitCount }, setError } = form;

  const onSubmit = form.handleSubmit((input) =>
    book.mutate(input, {
      onSuccess: onClose,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, FIELDS);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );

  const problem = formProblem(errors.root?.server?.message, book);

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Book a visit" className="flex flex-col gap-4">
      <ErrorSummary attempt={submitCount} failure={book.error} problem={problem} />
      <SelectField label="Kind of visit" error={errors.kind?.message} {...register('kind')}>
        {VISIT_KINDS.map((kind) => <option key={kind} value={kind}>{VISIT_KIND_LABELS[kind]}</option>)}
      </SelectField>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Date" type="date" error={errors.date?.message} {...register('date')} />
        <TextField label="Time" {...CLOCK_INPUT} hint={`The family's local time, ${CLOCK_HINT}`} error={errors.time?.message} {...register('time')} />
      </div>
      <TextField label="Length (minutes)" type="number" inputMode="numeric" error={errors.durationMinutes?.message}
        {...register('durationMinutes', asNumber)} />
      <SelectField label="Who will see the family" error={errors.staffId?.message} {...register('staffId')}>
        <option value="">{team.isPending ? 'Loading the team…' : 'Choose someone'}</option>
        {team.staff.map((person) => <option key={person.id} value={person.id}>{person.name}</option>)}
      </SelectField>
      <TextField label="What it is for" error={errors.purpose?.message} {...register('purpose')} />
      <FormActions pending={book.isPending} submitLabel="Book the visit" pendingLabel="Booking…" onCancel={onClose} />
    </form>
  );
}
