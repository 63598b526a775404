import { useId, type Ref, type TextareaHTMLAttributes } from 'react';
import { describedBy } from '../../../components/ui/field';

interface ReasonFieldProps extends TextareaHTMLAttributes<HTMLTextAreaElement> {
  label: string;
  hint?: string;
  error?: string;
  ref?: Ref<HTMLTextAreaElement>;
}

export function ReasonField({ label, hint, error, ...textarea }: ReasonFieldProps) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold text-ink-900">
        {label}
      </label>
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-ink-500">
          {hint}
        </p>
      )}
      <textarea
        id={id}
        rows={3}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, hint, error)}
        className={`block w-full rounded-lg border bg-surface-0 px-3 py-2 text-base text-ink-900 ${error ? 'border-danger-600' : 'border-surface-300'}`}
        {...textarea}
      />
      {error && (
        <p id={`${id}-error`} className="text-sm font-semibold text-danger-800">
          <span aria-hidden="true">⚠ </span>
          {error}
        </p>
      )}
    </div>
  );
}
