import { useState } from 'react';
import { FormProvider, useForm, type Path } from 'react-hook-form';
import { useQueryClient } from '@tanstack/react-query';
import type { Policy, UpdatePolicyInput } from '@shared/schemas/policy';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { ConflictNotice } from '../../../components/ui/conflict-notice';
import { errorMessage, isApiError } from '../../../lib/api-error';
import { policyQueryOptions } from '../api/get-policy';
import { useUpdatePolicy } from '../api/update-policy';
import { ContactsSection } from './contacts-section';
import { EquipmentSection, ReadingsSection } from './equipment-section';
import { formPathFor } from './policy-errors';
import { policyResolver } from './policy-resolver';
import { OximetrySection, ScheduleSection, SteppingDownSection, TargetsSection } from './policy-sections';
import { toFormValues, type PolicyFormValues } from './policy-values';
import { RemindersSection } from './reminders-section';
import { SupplySection } from './supply-section';
import { DischargeSection } from './discharge-section';
import { SupplierSettingsSection } from './supplier-settings-section';

export function PolicyForm({ policy, readOnly }: { policy: Policy; readOnly: boolean }) {
  const queryClient = useQueryClient();
  const update = useUpdatePolicy();
  const [conflict, setConflict] = useState<string>();
  const form = useForm<PolicyFormValues, unknown, UpdatePolicyInput>({ resolver: policyResolver, defaultValues: toFormValues(policy) });
  const { isDirty } = form.formState;

  const onSubmit = form.handleSubmit((input) =>
    update.mutate(input, {
      onError: (error) => {
        if (isApiError(error) && error.code === 'conflict') return setConflict(error.message);
        const leftover: string[] = [];
        for (const [path, messages] of Object.entries((isApiError(error) && error.details) || {})) {
          const field = formPathFor(path, form.getValues());
          if (field) form.setError(field as Path<PolicyFormValues>, { type: 'server', message: messages.join(' ') });
          else leftover.push(messages.join(' '));
        }
        if (leftover.length) form.setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    }),
  );

  // What was typed was based on a version that no longer exists: start again from the stored one.
  const reload = async () => {
    const fresh = await queryClient.fetchQuery({ ...policyQueryOptions(), staleTime: 0 });
    form.reset(toFormValues(fresh));
    setConflict(undefined);
    update.reset();
  };

  const handled = isApiError(update.error) && ['conflict', 'validation_failed'].includes(update.error.code);
  const problem = form.formState.errors.root?.server?.message ?? (update.isError && !handled ? errorMessage(update.error) : undefined);

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate aria-label="Programme settings" className="flex flex-col gap-5">
        {conflict && <ConflictNotice message={conflict} actionLabel="Reload the settings" onReload={reload} />}
        <ErrorSummary attempt={form.formState.submitCount} failure={update.error} problem={problem} />
        <fieldset disabled={readOnly} className="flex min-w-0 flex-col gap-5">
          <TargetsSection />
          <ScheduleSection />
          <SteppingDownSection />
          <OximetrySection />
          <EquipmentSection />
          <SupplySection />
          <SupplierSettingsSection />
          <ReadingsSection />
          <RemindersSection />
          <ContactsSection />
          <DischargeSection />
        </fieldset>
        {!readOnly && (
          <div className="sticky bottom-20 z-10 flex flex-wrap items-center gap-3 rounded-2xl border border-surface-200 bg-surface-0 p-3 shadow-md lg:bottom-4">
            <Button type="submit" disabled={!isDirty || update.isPending}>
              {update.isPending ? 'Saving…' : `Save as version ${policy.version + 1}`}
            </Button>
            <Button variant="quiet" disabled={!isDirty || update.isPending} onClick={() => form.reset()}>Discard changes</Button>
            <span className="text-sm text-ink-700">{isDirty ? 'Unsaved changes' : 'No changes yet'}</span>
          </div>
        )}
      </form>
    </FormProvider>
  );
}
