import { formatFlow } from '../../../components/clinical/clinical-format';
import { isBelowRequired, type DecisionFacts } from './decision-rules';

/** Each flowmeter step, marked against the proposal so a lower choice is visible before it is picked. */
export function StepOptions({ steps, rx }: { steps: readonly number[]; rx: DecisionFacts }) {
  return (
    <>
      {steps.map((step) => {
        const note =
          rx.proposedFlowLpm !== null && Math.abs(step - rx.proposedFlowLpm) < 1e-9
            ? ' (proposed)'
            : isBelowRequired(step, rx)
              ? ' (below required)'
              : '';
        return (
          <option key={step} value={String(step)}>
            {formatFlow(step)} L/min{note}
          </option>
        );
      })}
    </>
  );
}
