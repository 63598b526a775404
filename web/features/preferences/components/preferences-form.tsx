import { useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import type { Preferences, UpdatePreferencesInput } from '@shared/schemas/preferences';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { ConflictNotice } from '../../../components/ui/conflict-notice';
import { SelectField, TextField } from '../../../components/ui/field';
import { FormActions } from '../../../components/ui/form-actions';
import { errorMessage, isApiError } from '../../../lib/api-error';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { myPreferencesQueryOptions } from '../api/get-preferences';
import { useUpdatePreferences } from '../api/update-preferences';
import { LargeChoice, LargeChoiceGroup } from './large-choices';
import { languageOptions, PREFERENCE_FIELDS, preferencesResolver, toFormValues, type PreferencesFormValues } from './preference-values';
import { RemindersSwitch } from './reminders-switch';

const CHANGED_ELSEWHERE =
  'Your details were changed elsewhere, perhaps on another phone or by your care team. Reload to see them, then make your change again.';

export function PreferencesForm({ preferences, onSaved }: { preferences: Preferences; onSaved?: () => void }) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const update = useUpdatePreferences(onSaved);
  const [conflict, setConflict] = useState(false);
  const form = useForm<PreferencesFormValues, unknown, UpdatePreferencesInput>({
    resolver: preferencesResolver(preferences.country),
    defaultValues: toFormValues(preferences),
  });
  const { register, formState: { errors, submitCount }, setError } = form;

  const onSubmit = form.handleSubmit((input) =>
    update.mutate(input, {
      onError: (error) => {
        if (isApiError(error) && error.code === 'conflict') return setConflict(true);
        const leftover = applyServerFieldErrors(error, setError, PREFERENCE_FIELDS);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );

  // What was typed was based on details that no longer exist: start again from the stored ones.
  const reload = async () => {
    const fresh = await queryClient.fetchQuery({ ...myPreferencesQueryOptions(), staleTime: 0 });
    form.reset(toFormValues(fresh.preferences));
    setConflict(false);
    update.reset();
  };

  const handled = isApiError(update.error) && ['conflict', 'validation_failed'].includes(update.error.code);
  const problem = errors.root?.server?.message ?? (update.isError && !handled ? errorMessage(update.error) : undefined);

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate aria-label="Contact details and reminders" className="flex flex-col gap-6 text-lg">
        {conflict && <ConflictNotice large message={CHANGED_ELSEWHERE} actionLabel="Reload my details" onReload={reload} />}
        <ErrorSummary attempt={submitCount} failure={update.error} problem={problem} />
        <RemindersSwitch />
        <section className="flex flex-col gap-4">
          <h2 className="text-2xl font-bold text-ink-900">How to reach you</h2>
          <TextField label="Mobile number" type="tel" autoComplete="tel" inputMode="tel" hint="For text messages, e.g. +44 7700 900123"
            error={errors.mobile?.message} className="min-h-13" {...register('mobile')} />
          <TextField label="E-mail address" type="email" autoComplete="email" error={errors.email?.message} className="min-h-13"
            {...register('email')} />
          <LargeChoiceGroup legend="Best way to send you messages" error={errors.preferredChannel?.message}>
            <LargeChoice value="sms" label="Text message" {...register('preferredChannel')} />
            <LargeChoice value="email" label="E-mail" {...register('preferredChannel')} />
          </LargeChoiceGroup>
          <LargeChoiceGroup legend="You agree that we may send you" hint="You can change this at any time.">
            <LargeChoice type="checkbox" label="Text messages" {...register('consentSms')} />
            <LargeChoice type="checkbox" label="E-mails" {...register('consentEmail')} />
          </LargeChoiceGroup>
          <SelectField label="Language for messages" error={errors.language?.message} className="min-h-13" {...register('language')}>
            {languageOptions(preferences.language).map((option) => (
              <option key={option.code} value={option.code}>{option.label}</option>
            ))}
          </SelectField>
        </section>
        <FormActions pending={update.isPending} submitLabel="Save my choices" onCancel={() => navigate('/family')} />
      </form>
    </FormProvider>
  );
}
