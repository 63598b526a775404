import { get, useFormContext, type FieldError } from 'react-hook-form';
import type { z } from 'zod';
import { TextField } from '../../../components/ui/field';
import { asNumber } from '../../../lib/form-values';
import type { PolicyFormValues } from './policy-values';
import { rangeOf, rangeText, readableError } from './policy-sources';

type NumberPath =
  | `settings.spo2Targets.${keyof PolicyFormValues['settings']['spo2Targets']}`
  | `settings.schedule.${Exclude<keyof PolicyFormValues['settings']['schedule'], 'overnightStudyBeforeStepDown'>}`
  | `settings.stepDown.${keyof PolicyFormValues['settings']['stepDown']}`
  | `settings.oximetry.${keyof PolicyFormValues['settings']['oximetry']}`
  | 'settings.cannulaMaxFlowLpm'
  | 'settings.driftThresholdFio2'
  | 'settings.readingEditWindowMinutes'
  | 'settings.reminders.signOffWaitingHours'
  | 'settings.reminders.failureAlertPeriodMinutes'
  | 'settings.supply.reservePercent'
  | 'settings.discharge.firstVisitDaysAfterDischarge'
  | `settings.supply.cylinders.${number}.${'contentLitres' | 'fullPressure' | 'residualPressure'}`;

interface NumberSettingProps {
  name: NumberPath;
  label: string;
  /** The shared schema of this setting: its limits become the hint and the error wording. */
  schema: z.ZodNumber;
  unit?: string;
  /** Shown values are this many times the stored ones (percentage points for a fraction). */
  scale?: number;
  /** "Default 93 % · TSANZ 2020 / BTS 2009" */
  defaultText?: string;
}

export function NumberSetting({ name, label, schema, unit = '', scale = 1, defaultText }: NumberSettingProps) {
  const { register, formState } = useFormContext<PolicyFormValues>();
  const range = rangeOf(schema, scale);
  const error = get(formState.errors, name) as FieldError | undefined;
  const hint = [range ? rangeText(range, unit) : '', defaultText ?? ''].filter(Boolean).join(' · ');
  return (
    <TextField label={label} type="number" inputMode="decimal" step="any" hint={hint || undefined}
      error={readableError(error?.message, range)} className="max-w-40 tabular-nums" {...register(name, asNumber)} />
  );
}
