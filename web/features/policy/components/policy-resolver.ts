import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldErrors, Resolver } from 'react-hook-form';
import { updatePolicySchema, type UpdatePolicyInput } from '@shared/schemas/policy';
import { parseSteps, toCandidate, type PolicyFormValues } from './policy-values';

const shared = zodResolver(updatePolicySchema);

type StepErrors = Record<string, { message?: string } | undefined> & { message?: string };

/** One message for the steps box, whether zod faulted the list as a whole or one step in it. */
function stepsMessage(error: StepErrors | undefined, steps: readonly number[]): string | undefined {
  if (!error) return undefined;
  if (error.message) return error.message;
  const index = Object.keys(error).find((key) => /^\d+$/.test(key) && error[key]?.message);
  return index === undefined ? undefined : `${steps[Number(index)]} L/min: ${error[index]!.message}`;
}

/**
 * Reads the typed steps and the percentage points into the shared contract, then validates with the shared schema,
 * so the rules (ascending steps, ranges) are the server's own and "0.5, 0.25" is refused before anything is sent.
 */
export const policyResolver: Resolver<PolicyFormValues, unknown, UpdatePolicyInput> = async (values, context, options) => {
  const steps = parseSteps(values.settings.flowmeterStepsLpm);
  const candidate = toCandidate(values, steps);
  const result = await shared(candidate, context, options as never);
  const errors = { ...result.errors } as FieldErrors<PolicyFormValues> & { settings?: Record<string, unknown> };
  const stepError = steps.ok
    ? stepsMessage(errors.settings?.flowmeterStepsLpm as StepErrors | undefined, steps.steps)
    : steps.message;
  if (stepError) {
    errors.settings = { ...errors.settings, flowmeterStepsLpm: { type: 'steps', message: stepError } };
  }
  if (Object.keys(errors).length === 0) return { values: result.values as UpdatePolicyInput, errors: {} };
  return { values: {}, errors: errors as FieldErrors<PolicyFormValues> };
};
