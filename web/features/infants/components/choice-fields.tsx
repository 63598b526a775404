import { useId, type InputHTMLAttributes, type ReactNode, type Ref } from 'react';
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
