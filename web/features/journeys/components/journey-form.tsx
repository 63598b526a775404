import type { FormEvent } from 'react';
import { useRef } from 'react';
import { FormProvider, useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { createJourneySchemaOn, type CreateJourneyFormValues, type CreateJourneyInput, type Journey } from '@shared/schemas/journeys';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { useCreateJourney } from '../api/create-journey';
import { JourneyFormFields } from './journey-form-fields';

const FIELDS: readonly Path<CreateJourneyFormValues>[] = [
  'mode', 'destinationName', 'destinationElevationM', 'cabinAltitudeFt', 'departOn', 'returnOn', 'hoursAway', 'notes',
];

interface JourneyFormProps {
  infantId: string;
  /** YYYY-MM-DD in the programme's calendar: dates before it are refused here as on the server. */
  today: string;
  onSent: (journey: Journey) => void;
}

export function JourneyForm({ infantId, today, onSent }: JourneyFormProps) {
  const create = useCreateJourney(infantId);
  // A second tap can land before the button re-renders as disabled; one request must not be stored twice.
  const sending = useRef(false);
  const form = useForm<CreateJourneyFormValues, unknown, CreateJourneyInput>({
    resolver: zodResolver(createJourneySchemaOn(today)),
    defaultValues: { mode: 'road', destinationName: '', departOn: '', returnOn: '' },
    // A field hidden by the choice of road or air is not sent (a cabin altitude on a road trip is refused).
    shouldUnregister: true,
  });
  const { setError, formState } = form;

  // handleSubmit is called from the submit event, so the double-tap guard (a ref) is read then, never while drawing.
  const onSubmit = (event: FormEvent<HTMLFormElement>) => form.handleSubmit(async (input) => {
    if (sending.current) return;
    sending.current = true;
    try {
      onSent(await create.mutateAsync(input));
    } catch (error) {
      const leftover = applyServerFieldErrors(error, setError, FIELDS);
      if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
    } finally {
      sending.current = false;
    }
  })(event);

  const problem = formProblem(formState.errors.root?.server?.message, create);
  const busy = create.isPending || formState.isSubmitting;
  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate aria-label="Trip check" className="flex flex-col gap-5 text-lg">
        <ErrorSummary attempt={formState.submitCount} failure={create.error} problem={problem} />
        <JourneyFormFields />
        <Button type="submit" size="lg" disabled={busy} className="w-full sm:w-auto">
          {busy ? 'Sending…' : 'Send to the consultant'}
        </Button>
      </form>
    </FormProvider>
  );
}
