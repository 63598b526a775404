import { useId, type InputHTMLAttributes, type ReactNode, type Ref, type TextareaHTMLAttributes } from 'react';
import { describedBy } from '../../../components/ui/field';

function ErrorLine({ id, error }: { id: string; error?: string }) {
  if (!error) return null;
  return (
    <p id={id} className="text-sm font-semibold text-danger-800">
      <span aria-hidden="true">⚠ </span>
      {error}
    </p>
  );
}

interface ChoiceGroupProps {
  legend: string;
  hint?: string;
  error?: string;
  children: ReactNode;
  inline?: boolean;
}

/** A fieldset of radios or checkboxes whose legend names the question and whose error is announced with it. */
export function ChoiceGroup({ legend, hint, error, children, inline = false }: ChoiceGroupProps) {
  const id = useId();
  return (
    <fieldset aria-describedby={describedBy(id, hint, error)} aria-invalid={error ? true : undefined} className="flex flex-col gap-1.5">
      <legend className="mb-1 font-semibold text-ink-900">{legend}</legend>
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-ink-500">
          {hint}
        </p>
      )}
      <div className={inline ? 'flex flex-wrap gap-x-5 gap-y-2' : 'flex flex-col gap-2'}>{children}</div>
      <ErrorLine id={`${id}-error`} error={error} />
    </fieldset>
  );
}

interface ChoiceProps extends InputHTMLAttributes<HTMLInputElement> {
  label: ReactNode;
  type?: 'radio' | 'checkbox';
  ref?: Ref<HTMLInputElement>;
}

export function Choice({ label, type = 'radio', className = '', ...input }: ChoiceProps) {
  return (
    <label className={`flex min-h-11 cursor-pointer items-center gap-3 text-ink-900 ${className}`}>
      <input type={type} className="size-5 shrink-0 accent-brand-600" {...input} />
      <span>{label}</span>
    </label>
  );
}

interface TextAreaFieldProps extends TextareaHTMLAttributes<HTMLTextAreaElement> {
  label: string;
  hint?: string;
  error?: string;
  ref?: Ref<HTMLTextAreaElement>;
}

export function TextAreaField({ label, hint, error, id, ...textarea }: TextAreaFieldProps) {
  const generated = useId();
  const fieldId = id ?? generated;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={fieldId} className="font-semibold text-ink-900">
        {label}
      </label>
      {hint && (
        <p id={`${fieldId}-hint`} className="text-sm text-ink-500">
          {hint}
        </p>
      )}
      <textarea
        id={fieldId}
        rows={3}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(fieldId, hint, error)}
        className={`block w-full rounded-lg border bg-surface-0 px-3 py-2 text-base text-ink-900 ${error ? 'border-danger-600' : 'border-surface-300'}`}
        {...textarea}
      />
      <ErrorLine id={`${fieldId}-error`} error={error} />
    </div>
  );
}
