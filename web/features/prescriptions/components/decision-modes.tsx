import type { UseFormRegister } from 'react-hook-form';
import { formatFlow } from '../../../components/clinical/clinical-format';
import type { DecisionFacts, DecisionFormValues, DecisionMode } from './decision-rules';

interface DecisionModesProps {
  rx: DecisionFacts;
  register: UseFormRegister<DecisionFormValues>;
  current: DecisionMode;
}

/** The three possible decisions as large choices, so a thumb on a phone picks the intended one. */
export function DecisionModes({ rx, register, current }: DecisionModesProps) {
  const choices: { mode: DecisionMode; label: string; detail: string; disabled?: boolean }[] = [
    {
      mode: 'as_proposed',
      label: 'Approve as proposed',
      detail: rx.proposedFlowLpm === null ? 'No flowmeter step reaches the target' : `${formatFlow(rx.proposedFlowLpm)} L/min`,
      disabled: rx.proposedFlowLpm === null,
    },
    { mode: 'different', label: 'Approve a different flowmeter step', detail: 'Your reason is recorded' },
    { mode: 'send_back', label: 'Send back', detail: 'Not approved; the team is told why' },
  ];
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-2 font-semibold text-ink-900">Your decision</legend>
      <div className="grid gap-2 md:grid-cols-3">
        {choices.map((choice) => (
          <label
            key={choice.mode}
            className={`flex min-h-14 cursor-pointer items-start gap-3 rounded-xl border-2 p-3 ${
              current === choice.mode ? 'border-brand-600 bg-brand-50' : 'border-surface-200 bg-surface-0'
            } ${choice.disabled ? 'cursor-not-allowed opacity-60' : ''}`}
          >
            <input type="radio" value={choice.mode} disabled={choice.disabled} className="mt-1 size-5 accent-brand-600" {...register('mode')} />
            <span className="flex flex-col">
              <span className="font-semibold text-ink-900">{choice.label}</span>
              <span className="text-sm text-ink-700">{choice.detail}</span>
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
