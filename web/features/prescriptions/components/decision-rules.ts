import { z } from 'zod';
import { FLOW_TOLERANCE_LPM } from '@shared/clinical/flowmeter';
import { unmetInEvidence } from '@shared/schedule/step-down-rules';
import { decisionSchema, type DecisionInput, type Prescription } from '@shared/schemas/prescriptions';

export const DECISION_MODES = ['as_proposed', 'different', 'send_back'] as const;
export type DecisionMode = (typeof DECISION_MODES)[number];
export const PERIODS = ['awake', 'asleep', 'feeding'] as const;
export type Period = (typeof PERIODS)[number];
/** A period select left at this value gets the approved flow. */
export const SAME = 'same';

export interface DecisionFormValues {
  mode: DecisionMode;
  flowLpm: string;
  reason: string;
  periods: Record<Period, string>;
}

export type DecisionFacts = Pick<Prescription, 'proposedFlowLpm' | 'requiredFlowLpm'> & Partial<Pick<Prescription, 'evidence'>>;

/** The programme's step-down rules the proposal's evidence records as not met (empty for other proposals). */
export const unmetChecksOf = (rx: DecisionFacts) => unmetInEvidence(rx.evidence);
export const unmetReasonMessage = (n: number) => `${n} step-down ${n === 1 ? 'rule is' : 'rules are'} not met: record why you approve anyway`;

export const isBelowRequired = (flowLpm: number, rx: DecisionFacts) =>
  rx.requiredFlowLpm !== null && flowLpm < rx.requiredFlowLpm - FLOW_TOLERANCE_LPM;

export const BELOW_REQUIRED_WARNING = 'This is below the flow the computation requires; your reason will be recorded.';

export function defaultDecisionValues(rx: DecisionFacts): DecisionFormValues {
  return {
    mode: rx.proposedFlowLpm === null ? 'different' : 'as_proposed',
    flowLpm: '',
    reason: '',
    periods: { awake: SAME, asleep: SAME, feeding: SAME },
  };
}

/** The flow the approval will record: the chosen step, or the proposal when none was chosen. */
export function approvedFlowOf(values: Pick<DecisionFormValues, 'mode' | 'flowLpm'>, rx: DecisionFacts): number | null {
  if (values.mode === 'different') return values.flowLpm === '' ? null : Number(values.flowLpm);
  return rx.proposedFlowLpm;
}

function toDecision(values: DecisionFormValues, rx: DecisionFacts): unknown {
  const reason = values.reason.trim() || undefined;
  if (values.mode === 'send_back') return { decision: 'reject', reason };
  const flow = approvedFlowOf(values, rx);
  const differs = PERIODS.some((p) => values.periods[p] !== SAME);
  const periods = differs
    ? Object.fromEntries(PERIODS.map((p) => [p, values.periods[p] === SAME ? flow : Number(values.periods[p])]))
    : undefined;
  return {
    decision: 'approve',
    ...(values.mode === 'different' ? { flowLpm: flow } : {}),
    ...(reason ? { reason } : {}),
    ...(periods ? { periods } : {}),
  };
}

/**
 * The form's values checked by the same rules the server applies, then turned into the shared decision contract
 * and validated by it. The rules are repeated here only so a consultant hears about them before anything is sent.
 */
export function decisionFormSchema(rx: DecisionFacts) {
  return z
    .object({
      mode: z.enum(DECISION_MODES),
      flowLpm: z.string(),
      reason: z.string(),
      periods: z.object({ awake: z.string(), asleep: z.string(), feeding: z.string() }),
    })
    .superRefine((v, ctx) => {
      const unmet = unmetChecksOf(rx).length;
      if (v.mode === 'as_proposed' && unmet > 0 && !v.reason.trim()) {
        ctx.addIssue({ code: 'custom', path: ['reason'], message: unmetReasonMessage(unmet) });
        return;
      }
      if (v.mode !== 'different') return;
      if (v.flowLpm === '') {
        ctx.addIssue({ code: 'custom', path: ['flowLpm'], message: 'Choose a flowmeter step' });
        return;
      }
      if (v.reason.trim()) return;
      const message = unmet > 0 ? unmetReasonMessage(unmet) : isBelowRequired(Number(v.flowLpm), rx)
        ? 'This flow is below the required flow: give the reason, it will be recorded'
        : 'Say why you chose a different flow from the proposal';
      ctx.addIssue({ code: 'custom', path: ['reason'], message });
    })
    .transform((v) => toDecision(v, rx))
    .pipe(decisionSchema);
}

export type { DecisionInput };
