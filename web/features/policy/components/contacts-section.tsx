import { get, useFieldArray, useFormContext, type FieldError } from 'react-hook-form';
import { countryChoices } from '@shared/phone/phone';
import { Button } from '../../../components/ui/button';
import { ListError, TextSetting } from './policy-list-field';
import { defaultText, Section } from './policy-sections';
import type { PolicyFormValues } from './policy-values';

// The shared schema's own limit (programmeContactsSchema.phones.max).
const MAX_PHONES = 8;
// Built once: about 240 countries, named in English.
const COUNTRIES = countryChoices();

/** The country whose numbers are typed without a country code: families' and the programme's numbers are read in it. */
function CountrySetting() {
  const { register, formState } = useFormContext<PolicyFormValues>();
  const error = get(formState.errors, 'settings.country') as FieldError | undefined;
  return (
    <div className="flex flex-col gap-1 sm:col-span-2">
      <label htmlFor="policy-country" className="font-semibold text-ink-900">Country for phone numbers</label>
      <p id="policy-country-hint" className="text-sm text-ink-700">
        A number typed without its country code (such as 07700 900123) is read as a number of this country, and shown in its own form.
      </p>
      <select
        id="policy-country"
        {...register('settings.country')}
        aria-describedby="policy-country-hint"
        aria-invalid={error ? true : undefined}
        className="min-h-11 max-w-full rounded-lg border border-surface-300 bg-surface-0 px-3 sm:max-w-md"
      >
        {COUNTRIES.map((c) => (
          <option key={c.code} value={c.code}>
            {c.name} (+{c.callingCode})
          </option>
        ))}
      </select>
      {error?.message && <p className="text-sm text-danger-800">{error.message}</p>}
    </div>
  );
}

/** The numbers a family calls, shown on the family page and the printed care plan. */
export function ContactsSection() {
  const { control } = useFormContext<PolicyFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'settings.contacts.phones' });
  return (
    <Section title="Numbers for families">
      <CountrySetting />
      <div className="flex flex-col gap-4 sm:col-span-2">
        {fields.length === 0 && <p className="text-ink-700">No numbers yet: families only see the emergency number.</p>}
        {fields.map((field, index) => (
          <fieldset key={field.id} className="grid gap-4 rounded-xl border border-surface-200 p-3 sm:grid-cols-2 sm:p-4">
            <legend className="px-1 font-bold text-ink-900">Phone number {index + 1}</legend>
            <TextSetting name={`settings.contacts.phones.${index}.label`} label="Who answers" hint="e.g. Home oxygen nurses" />
            <TextSetting name={`settings.contacts.phones.${index}.number`} type="tel" inputMode="tel" label="Number" />
            <div className="sm:col-span-2">
              <TextSetting name={`settings.contacts.phones.${index}.when`} label="When to call" hint="e.g. Weekdays 08:00–18:00 (optional)" />
            </div>
            <div>
              <Button variant="quiet" size="sm" onClick={() => remove(index)}>Remove phone number {index + 1}</Button>
            </div>
          </fieldset>
        ))}
        <ListError name="settings.contacts.phones" />
        <div>
          <Button variant="secondary" disabled={fields.length >= MAX_PHONES} onClick={() => append({ label: '', number: '', when: '' })}>
            Add a phone number
          </Button>
          {fields.length >= MAX_PHONES && <p className="mt-1 text-sm text-ink-500">At most {MAX_PHONES} numbers.</p>}
        </div>
      </div>
      <TextSetting name="settings.contacts.emergencyNumber" inputMode="numeric" label="Local emergency number"
        hint={`Digits only · ${defaultText('999')}`} className="max-w-40" />
    </Section>
  );
}
