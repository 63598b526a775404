import { useFieldArray, useFormContext } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Choice, ChoiceGroup } from './choice-fields';
import { ContactLocaleFields } from './contact-locale-fields';
import { emptyContact, type ContactValues } from './enrol-values';
import { errorText } from './form-helpers';

const MAX_CONTACTS = 4;

interface ContactFieldsProps {
  /** New contacts start in the programme's time zone. */
  defaultTimeZone: string;
}

/** 1–4 family contacts, for any form whose values hold `contacts` (enrolment and the record's contact editor). */
export function ContactFields({ defaultTimeZone }: ContactFieldsProps) {
  const {
    control,
    register,
    formState: { errors },
  } = useFormContext<{ contacts: ContactValues[] }>();
  const { fields, append, remove } = useFieldArray({ control, name: 'contacts' });
  const err = (path: string) => errorText(errors, path);
  const listError = err('contacts') ?? err('contacts.root');
  return (
    <div className="flex flex-col gap-4">
      {fields.map((field, index) => {
        const at = (key: keyof ContactValues) => `contacts.${index}.${key}` as const;
        return (
          <fieldset key={field.id} className="flex flex-col gap-4 rounded-xl border border-surface-200 p-3 sm:p-4">
            <legend className="px-1 font-bold text-ink-900">Family contact {index + 1}</legend>
            <div className="grid gap-4 sm:grid-cols-2">
              <TextField label="Name" autoComplete="off" error={err(at('name'))} {...register(at('name'))} />
              <TextField label="Relation to the baby" hint="e.g. mother, grandfather" error={err(at('relation'))} {...register(at('relation'))} />
              <TextField label="Mobile number" type="tel" autoComplete="off" error={err(at('mobile'))} {...register(at('mobile'))} />
              <TextField label="E-mail address" type="email" autoComplete="off" error={err(at('email'))} {...register(at('email'))} />
            </div>
            <ChoiceGroup legend="Preferred way to reach them" error={err(at('preferredChannel'))} inline>
              <Choice value="sms" label="SMS" {...register(at('preferredChannel'))} />
              <Choice value="email" label="E-mail" {...register(at('preferredChannel'))} />
            </ChoiceGroup>
            <ChoiceGroup legend="Consent to reminders" inline>
              <Choice type="checkbox" label="Agrees to SMS" {...register(at('consentSms'))} />
              <Choice type="checkbox" label="Agrees to e-mail" {...register(at('consentEmail'))} />
            </ChoiceGroup>
            <ContactLocaleFields index={index} defaultTimeZone={defaultTimeZone} />
            {fields.length > 1 && (
              <div>
                <Button variant="quiet" size="sm" onClick={() => remove(index)}>
                  Remove contact {index + 1}
                </Button>
              </div>
            )}
          </fieldset>
        );
      })}
      {listError && (
        <p role="alert" className="font-semibold text-danger-800">
          {listError}
        </p>
      )}
      <div>
        <Button variant="secondary" disabled={fields.length >= MAX_CONTACTS} onClick={() => append(emptyContact(defaultTimeZone))}>
          Add another contact
        </Button>
        {fields.length >= MAX_CONTACTS && <p className="mt-1 text-sm text-ink-500">At most {MAX_CONTACTS} contacts.</p>}
      </div>
    </div>
  );
}
