import { get, useFormContext, type FieldError } from 'react-hook-form';
import { CLOCK_HINT, CLOCK_INPUT } from '../../../components/ui/clock-input';
import { TextField } from '../../../components/ui/field';
import type { PolicyFormValues } from './policy-values';

type TextPath =
  | `settings.reminders.${Exclude<keyof PolicyFormValues['settings']['reminders'], 'signOffWaitingHours' | 'failureAlertPeriodMinutes'>}`
  | 'settings.contacts.emergencyNumber'
  | `settings.contacts.phones.${number}.${'label' | 'number' | 'when'}`
  | `settings.supply.cylinders.${number}.${'id' | 'name'}`
  | `settings.discharge.items.${number}.${'key' | 'label' | 'familyLabel' | 'source'}`
  | `settings.supplier.${'name' | 'orderEmail' | 'phone'}`;

interface TextSettingProps {
  name: TextPath;
  label: string;
  hint?: string;
  type?: 'text' | 'time' | 'tel' | 'email';
  className?: string;
  inputMode?: 'text' | 'numeric' | 'tel';
}

/** A text or clock setting; its message comes from the shared schema or from the server's 400, on the same path. */
export function TextSetting({ name, label, hint, type = 'text', className = '', inputMode }: TextSettingProps) {
  const { register, formState } = useFormContext<PolicyFormValues>();
  const error = get(formState.errors, name) as FieldError | undefined;
  // A clock setting is typed as text: the browser's time box shows "am"/"pm" in some locales, and times here are
  // always on the 24-hour clock.
  const clock = type === 'time';
  return (
    <TextField label={label} type={clock ? 'text' : type} hint={clock ? [CLOCK_HINT, hint].filter(Boolean).join('. ') : hint}
      inputMode={inputMode} error={error?.message} className={className} spellCheck={false} {...(clock ? CLOCK_INPUT : {})} {...register(name)} />
  );
}

/** A message about a whole list (too many rows, two cylinders with one code), from zod or from the server. */
export function ListError({ name }: { name: 'settings.contacts.phones' | 'settings.supply.cylinders' | 'settings.discharge.items' }) {
  const { formState } = useFormContext<PolicyFormValues>();
  const message = (get(formState.errors, name) as FieldError | undefined)?.message
    ?? (get(formState.errors, `${name}.root`) as FieldError | undefined)?.message;
  if (!message) return null;
  return (
    <p role="alert" className="font-semibold text-danger-800 sm:col-span-2">
      <span aria-hidden="true">⚠ </span>
      {message}
    </p>
  );
}
