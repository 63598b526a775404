import { get, useFormContext, type FieldError } from 'react-hook-form';
import { TextField } from '../../../components/ui/field';
import type { PolicyFormValues } from './policy-values';

type TextPath =
  | `settings.reminders.${Exclude<keyof PolicyFormValues['settings']['reminders'], 'signOffWaitingHours' | 'failureAlertPeriodMinutes'>}`
  | 'settings.contacts.emergencyNumber'
  | `settings.contacts.phones.${number}.${'label' | 'number' | 'when'}`
  | `settings.supply.cylinders.${number}.${'id' | 'name'}`;

interface TextSettingProps {
  name: TextPath;
  label: string;
  hint?: string;
  type?: 'text' | 'time' | 'tel';
  className?: string;
  inputMode?: 'text' | 'numeric' | 'tel';
}

/** A text or clock setting; its message comes from the shared schema or from the server's 400, on the same path. */
export function TextSetting({ name, label, hint, type = 'text', className = '', inputMode }: TextSettingProps) {
  const { register, formState } = useFormContext<PolicyFormValues>();
  const error = get(formState.errors, name) as FieldError | undefined;
  return (
    <TextField label={label} type={type} hint={hint} inputMode={inputMode} error={error?.message} className={className}
      spellCheck={false} {...register(name)} />
  );
}

/** A message about a whole list (too many rows, two cylinders with one code), from zod or from the server. */
export function ListError({ name }: { name: 'settings.contacts.phones' | 'settings.supply.cylinders' }) {
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
