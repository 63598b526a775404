import { useId } from 'react';
import { useController, useFormContext } from 'react-hook-form';
import type { PreferencesFormValues } from './preference-values';

export const REMINDERS_OFF_WORDS = 'We will not send you visit reminders. We will still tell you if a visit is moved or cancelled, and your nurse can still call you.';
export const REMINDERS_ON_WORDS = 'We will remind you the day before each visit and on the morning of the visit.';

/** One large on/off control with its meaning in words beside it, so turning reminders off is easy and understood. */
export function RemindersSwitch() {
  const labelId = useId();
  const { control } = useFormContext<PreferencesFormValues>();
  const {
    field: { value: on, onChange, onBlur, ref },
  } = useController({ control, name: 'remindersEnabled' });
  return (
    <section className={`flex flex-col gap-3 rounded-2xl border-2 p-5 ${on ? 'border-brand-600 bg-brand-50' : 'border-surface-300 bg-surface-50'}`}>
      <div className="flex flex-wrap items-center justify-between gap-4">
        <h2 id={labelId} className="text-2xl font-bold text-ink-900">Visit reminders</h2>
        <button
          ref={ref}
          type="button"
          role="switch"
          aria-checked={on}
          aria-labelledby={labelId}
          aria-describedby={`${labelId}-words`}
          onClick={() => onChange(!on)}
          onBlur={onBlur}
          className="inline-flex min-h-13 items-center gap-3 rounded-full border-2 border-ink-700 bg-surface-0 py-1 pr-5 pl-1 text-xl font-bold text-ink-900"
        >
          <span aria-hidden="true" className={`flex h-10 w-18 items-center rounded-full p-1 ${on ? 'justify-end bg-brand-600' : 'justify-start bg-surface-300'}`}>
            <span className="size-8 rounded-full bg-surface-0 shadow" />
          </span>
          <span aria-hidden="true">{on ? 'On' : 'Off'}</span>
        </button>
      </div>
      <p id={`${labelId}-words`} className="text-xl leading-relaxed text-ink-900">
        {on ? REMINDERS_ON_WORDS : REMINDERS_OFF_WORDS}
      </p>
    </section>
  );
}
