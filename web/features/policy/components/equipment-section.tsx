import { useId } from 'react';
import { get, useFormContext, useWatch, type FieldError } from 'react-hook-form';
import { DEFAULT_POLICY_SETTINGS, policySettingsSchema } from '@shared/schemas/policy';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { describedBy, SelectField } from '../../../components/ui/field';
import { NumberSetting } from './policy-field';
import { defaultText, Section } from './policy-sections';
import { parseSteps, type PolicyFormValues } from './policy-values';

export const PRESSURE_MODEL_LABELS = {
  'isa-1976': 'International Standard Atmosphere (1976)',
  'west-1996': 'West 1996 high-altitude model',
} as const;

function StepsField() {
  const id = useId();
  const { register, formState, control } = useFormContext<PolicyFormValues>();
  const text = useWatch({ control, name: 'settings.flowmeterStepsLpm' });
  const error = (get(formState.errors, 'settings.flowmeterStepsLpm') as FieldError | undefined)?.message;
  const parsed = parseSteps(text ?? '');
  const hint = 'Separate with commas, lowest first, e.g. 0.025, 0.05, 0.1';
  return (
    <div className="flex flex-col gap-1 sm:col-span-2">
      <label htmlFor={id} className="font-semibold text-ink-900">Flowmeter steps (L/min)</label>
      <p id={`${id}-hint`} className="text-sm text-ink-500">{hint}</p>
      <textarea id={id} rows={4} spellCheck={false} aria-invalid={error ? true : undefined} aria-describedby={describedBy(id, hint, error)}
        className={`block w-full rounded-lg border bg-surface-0 px-3 py-2 text-base tabular-nums text-ink-900 field-sizing-content min-h-24 ${error ? 'border-danger-600' : 'border-surface-300'}`}
        {...register('settings.flowmeterStepsLpm')} />
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-danger-800">
          <span aria-hidden="true">⚠ </span>
          {error}
        </p>
      ) : (
        parsed.ok && (
          <p className="text-sm text-ink-700">
            {parsed.steps.length} {parsed.steps.length === 1 ? 'step' : 'steps'}, {formatFlow(parsed.steps[0])} to{' '}
            {formatFlow(parsed.steps[parsed.steps.length - 1])} L/min
          </p>
        )
      )}
    </div>
  );
}

export function EquipmentSection() {
  const shape = policySettingsSchema.shape;
  const { register, formState } = useFormContext<PolicyFormValues>();
  return (
    <Section title="Flowmeter and cannula">
      <StepsField />
      <NumberSetting name="settings.cannulaMaxFlowLpm" label="Highest cannula flow (L/min)" schema={shape.cannulaMaxFlowLpm}
        defaultText={defaultText(DEFAULT_POLICY_SETTINGS.cannulaMaxFlowLpm)} />
      <NumberSetting name="settings.driftThresholdFio2" label="Flag growth drift when delivered FiO2 falls by (percentage points)" scale={100}
        schema={shape.driftThresholdFio2} defaultText={defaultText(DEFAULT_POLICY_SETTINGS.driftThresholdFio2 * 100)} />
      <div className="sm:col-span-2">
        <SelectField label="Air pressure from elevation" hint="Named on every worked setting" className="sm:max-w-md"
          error={formState.errors.settings?.pressureModel?.message} {...register('settings.pressureModel')}>
          {Object.entries(PRESSURE_MODEL_LABELS).map(([value, label]) => (
            <option key={value} value={value}>{label}</option>
          ))}
        </SelectField>
      </div>
    </Section>
  );
}

export function ReadingsSection() {
  return (
    <Section title="Readings">
      <NumberSetting name="settings.readingEditWindowMinutes" label="Time to correct a saved reading (minutes)"
        schema={policySettingsSchema.shape.readingEditWindowMinutes} defaultText={defaultText(DEFAULT_POLICY_SETTINGS.readingEditWindowMinutes)} />
    </Section>
  );
}
