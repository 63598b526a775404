import { useId, type InputHTMLAttributes, type ReactNode, type Ref } from 'react';
import { describedBy } from '../../../components/ui/field';

interface ChoiceGroupProps {
  legend: string;
  hint?: string;
  error?: string;
  children: ReactNode;
}

/** A question with radios or checkboxes, sized for a thumb on a phone; its error is announced with it. */
export function LargeChoiceGroup({ legend, hint, error, children }: ChoiceGroupProps) {
  const id = useId();
  return (
    <fieldset aria-describedby={describedBy(id, hint, error)} aria-invalid={error ? true : undefined} className="flex flex-col gap-2">
      <legend className="mb-1 text-xl font-bold text-ink-900">{legend}</legend>
      {hint && <p id={`${id}-hint`} className="text-ink-700">{hint}</p>}
      <div className="flex flex-col gap-2">{children}</div>
      {error && (
        <p id={`${id}-error`} className="font-semibold text-danger-800">
          <span aria-hidden="true">⚠ </span>
          {error}
        </p>
      )}
    </fieldset>
  );
}

interface ChoiceProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  type?: 'radio' | 'checkbox';
  ref?: Ref<HTMLInputElement>;
}

export function LargeChoice({ label, type = 'radio', ...input }: ChoiceProps) {
  return (
    <label className="flex min-h-13 cursor-pointer items-center gap-4 rounded-xl border border-surface-300 bg-surface-0 px-4 text-lg text-ink-900 has-[:checked]:border-brand-600 has-[:checked]:bg-brand-50">
      <input type={type} className="size-6 shrink-0 accent-brand-600" {...input} />
      <span>{label}</span>
    </label>
  );
}
