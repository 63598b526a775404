import { FormProvider, useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { replaceContactsSchemaFor } from '@shared/schemas/infant-contacts';
import type { InfantDetail } from '@shared/schemas/infants';
import { DEFAULT_COUNTRY, formatPhone, isCountryCode, type CountryCode } from '@shared/phone/phone';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { FormActions } from '../../../components/ui/form-actions';
import { errorMessage, isApiError } from '../../../lib/api-error';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { useReplaceContacts } from '../api/update-infant';
import { ContactFields } from './contact-fields';

type ContactsSchema = ReturnType<typeof replaceContactsSchemaFor>;
type ContactsValues = z.input<ContactsSchema>;

function toValues(infant: InfantDetail, country: CountryCode): ContactsValues {
  return {
    contacts: infant.contacts.map(({ id: _id, mobile, email, ...rest }) => ({ ...rest, mobile: mobile ? formatPhone(mobile, country) : '', email: email ?? '' })),
  };
}

/** Replaces the whole contact list in one save, checked with the same contract as enrolment. */
export function ContactsEditor({ infant, onDone }: { infant: InfantDetail; onDone: () => void }) {
  const user = useSignedInUser();
  const save = useReplaceContacts(infant.id);
  const country = isCountryCode(user.programmeCountry) ? user.programmeCountry : DEFAULT_COUNTRY;
  const form = useForm<ContactsValues, unknown, z.output<ContactsSchema>>({
    resolver: zodResolver(replaceContactsSchemaFor(country)),
    defaultValues: toValues(infant, country),
    mode: 'onTouched',
  });

  const onSubmit = form.handleSubmit((values) =>
    save.mutate(values.contacts, {
      onSuccess: onDone,
      onError: (error) => {
        if (!isApiError(error) || !error.details) return;
        for (const [path, messages] of Object.entries(error.details)) {
          form.setError(path as Path<ContactsValues>, { type: 'server', message: messages.join(' ') });
        }
      },
    }),
  );

  const inline = isApiError(save.error) && save.error.code === 'validation_failed';
  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        <ErrorSummary attempt={form.formState.submitCount} failure={save.error} problem={save.isError && !inline ? errorMessage(save.error) : undefined} />
        <ContactFields defaultTimeZone={user.programmeTimeZone} />
        <FormActions pending={save.isPending} submitLabel="Save contacts" onCancel={onDone} />
      </form>
    </FormProvider>
  );
}
