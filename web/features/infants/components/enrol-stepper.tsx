import { ENROL_STEPS } from './enrol-values';

interface EnrolStepperProps {
  current: number;
  /** Steps already checked and passed (a "Next" went past them); marked with a tick and in words. */
  done: ReadonlySet<number>;
  /** Steps with a field error, marked in words as well as colour. */
  withErrors: ReadonlySet<number>;
  onGo: (step: number) => void;
}

function Tick() {
  return (
    <svg viewBox="0 0 16 16" aria-hidden="true" className="size-3.5" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" strokeLinejoin="round">
      <path d="M3 8.5l3.2 3L13 4.5" />
    </svg>
  );
}

function stateOf(index: number, current: number, done: ReadonlySet<number>, withErrors: ReadonlySet<number>) {
  if (withErrors.has(index)) return 'problem';
  if (index === current) return 'current';
  return done.has(index) ? 'done' : 'todo';
}

const BUTTON = {
  problem: 'border-danger-600 bg-surface-0 text-ink-900',
  current: 'border-brand-600 bg-brand-50 text-brand-800',
  done: 'border-ok-200 bg-ok-50 text-ink-900 hover:bg-ok-200',
  todo: 'border-surface-200 bg-surface-0 text-ink-700 hover:bg-surface-100',
} as const;
const DOT = {
  problem: 'bg-danger-600 text-white',
  current: 'bg-brand-600 text-white',
  done: 'bg-ok-600 text-white',
  todo: 'bg-surface-200 text-ink-900',
} as const;
const WORDS = { problem: ' (needs a fix)', current: '', done: ' (done)', todo: '' } as const;

/**
 * One row of equal parts that never wraps: on a phone only the numbers (and ticks) show, the current step's name
 * being the heading below; from 640 px each part shows its name, which may take two lines inside its own box.
 */
export function EnrolStepper({ current, done, withErrors, onGo }: EnrolStepperProps) {
  return (
    <nav aria-label="Enrolment steps">
      <ol className="grid grid-cols-5 gap-1 p-1.5">
        {ENROL_STEPS.map((step, index) => {
          const state = stateOf(index, current, done, withErrors);
          return (
            <li key={step.title} className="min-w-0">
              <button
                type="button"
                onClick={() => onGo(index)}
                aria-current={index === current ? 'step' : undefined}
                className={`focus-inset flex h-full min-h-11 w-full items-center justify-center gap-2 rounded-lg border px-1.5 py-1 text-left text-sm font-semibold sm:justify-start sm:px-2 ${BUTTON[state]}`}
              >
                <span aria-hidden="true" className={`flex size-6 shrink-0 items-center justify-center rounded-full ${DOT[state]}`}>
                  {state === 'done' ? <Tick /> : state === 'problem' ? '!' : index + 1}
                </span>
                <span className="sr-only sm:not-sr-only sm:leading-tight">
                  <span className="sr-only">Step {index + 1}: </span>
                  {step.title}
                  <span className={state === 'problem' ? 'block text-danger-800' : 'sr-only'}>{WORDS[state]}</span>
                </span>
              </button>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
