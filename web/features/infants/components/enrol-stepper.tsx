import { ENROL_STEPS } from './enrol-values';

interface EnrolStepperProps {
  current: number;
  /** Steps with a field error, marked in words as well as colour. */
  withErrors: ReadonlySet<number>;
  onGo: (step: number) => void;
}

export function EnrolStepper({ current, withErrors, onGo }: EnrolStepperProps) {
  return (
    <nav aria-label="Enrolment steps">
      <ol className="flex gap-1 overflow-x-auto p-1.5 sm:flex-wrap">
        {ENROL_STEPS.map((step, index) => {
          const active = index === current;
          const problem = withErrors.has(index);
          return (
            <li key={step.title} className="shrink-0">
              <button
                type="button"
                onClick={() => onGo(index)}
                aria-current={active ? 'step' : undefined}
                className={`focus-inset flex min-h-11 items-center gap-2 rounded-lg border px-3 text-sm font-semibold ${
                  active ? 'border-brand-600 bg-brand-50 text-brand-800' : 'border-surface-200 bg-surface-0 text-ink-700 hover:bg-surface-100'
                } ${problem ? 'border-danger-600' : ''}`}
              >
                <span aria-hidden="true" className={`flex size-6 items-center justify-center rounded-full ${active ? 'bg-brand-600 text-white' : 'bg-surface-200'}`}>
                  {index + 1}
                </span>
                <span>{step.title}</span>
                {problem && <span className="text-danger-800">(needs a fix)</span>}
              </button>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
