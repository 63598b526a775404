import type { ReactNode } from 'react';
import { useFormContext } from 'react-hook-form';
import { DEFAULT_POLICY_SETTINGS, oximetryRulesSchema, scheduleRulesSchema, spo2TargetsSchema, stepDownRulesSchema } from '@shared/schemas/policy';
import { NumberSetting } from './policy-field';
import { policySectionId } from './policy-section-nav';
import { SOURCES } from './policy-sources';
import type { PolicyFormValues } from './policy-values';

const D = DEFAULT_POLICY_SETTINGS;
export const defaultText = (value: number | string, source?: string) => `Default ${value}${source ? ` — ${source}` : ''}`;

export function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset id={policySectionId(title)} className="scroll-mt-4 rounded-2xl border border-surface-200 bg-surface-0 p-4 shadow-sm sm:p-6">
      <legend className="float-left mb-4 w-full text-lg font-bold text-ink-900">{title}</legend>
      <div className="clear-both grid gap-x-6 gap-y-5 sm:grid-cols-2">{children}</div>
    </fieldset>
  );
}

export function TargetsSection() {
  const t = spo2TargetsSchema.shape;
  return (
    <Section title="Saturation targets">
      <NumberSetting name="settings.spo2Targets.overnightMeanMin" label="Overnight mean SpO2, at least (%)" schema={t.overnightMeanMin}
        defaultText={defaultText(`${D.spo2Targets.overnightMeanMin} %`, SOURCES.satTargets)} />
      <NumberSetting name="settings.spo2Targets.pctBelow90Max" label="Time below 90 % SpO2, less than (% of the night)" schema={t.pctBelow90Max}
        defaultText={defaultText(`${D.spo2Targets.pctBelow90Max} %`, SOURCES.satTargets)} />
      <NumberSetting name="settings.spo2Targets.pulmonaryHypertensionMeanMin" label="With pulmonary hypertension: overnight mean SpO2, at least (%)"
        schema={t.pulmonaryHypertensionMeanMin} defaultText={defaultText(`${D.spo2Targets.pulmonaryHypertensionMeanMin} %`, SOURCES.pulmonaryHypertension)} />
      <NumberSetting name="settings.spo2Targets.spotMeanMin" label="Recent spot readings: mean SpO2, at least (%)" schema={t.spotMeanMin}
        defaultText={defaultText(`${D.spo2Targets.spotMeanMin} %`, SOURCES.spotMean)} />
      <NumberSetting name="settings.spo2Targets.spotLowMax" label="A spot reading at or below this is low (%)" schema={t.spotLowMax}
        defaultText={defaultText(`${D.spo2Targets.spotLowMax} %`, SOURCES.spotLow)} />
    </Section>
  );
}

export function ScheduleSection() {
  const s = scheduleRulesSchema.shape;
  const d = D.schedule;
  const { register } = useFormContext<PolicyFormValues>();
  const practice = (value: number | string) => defaultText(value, SOURCES.commonPractice);
  return (
    <Section title="Check schedule">
      <NumberSetting name="settings.schedule.firstCheckWithinHours" label="First home check within (hours)" schema={s.firstCheckWithinHours} defaultText={practice(d.firstCheckWithinHours)} />
      <NumberSetting name="settings.schedule.weeklyChecks" label="Weekly checks for the first (weeks)" schema={s.weeklyChecks} defaultText={practice(d.weeklyChecks)} />
      <NumberSetting name="settings.schedule.thenEveryWeeks" label="Then a check every (weeks)" schema={s.thenEveryWeeks} defaultText={practice(d.thenEveryWeeks)} />
      <NumberSetting name="settings.schedule.planAheadWeeks" label="Plan checks ahead for (weeks)" schema={s.planAheadWeeks} defaultText={practice(d.planAheadWeeks)} />
      <NumberSetting name="settings.schedule.followUpDaysAfterStepDown" label="Follow-up check after a step down (days)" schema={s.followUpDaysAfterStepDown}
        defaultText={practice(d.followUpDaysAfterStepDown)} />
      <div className="flex flex-col gap-1">
        <label className="flex min-h-11 cursor-pointer items-center gap-3 font-semibold text-ink-900">
          <input type="checkbox" className="size-5 accent-brand-600" {...register('settings.schedule.overnightStudyBeforeStepDown')} />
          Overnight study before each step down
        </label>
        <p className="text-sm text-ink-500">{practice(d.overnightStudyBeforeStepDown ? 'yes' : 'no')}</p>
      </div>
    </Section>
  );
}

export function SteppingDownSection() {
  const s = stepDownRulesSchema.shape;
  const d = D.stepDown;
  const practice = (value: number | string) => defaultText(value, SOURCES.commonPractice);
  return (
    <Section title="Stepping down">
      <NumberSetting name="settings.stepDown.stepsPerDecrease" label="Flowmeter steps down at a time" schema={s.stepsPerDecrease} defaultText={practice(d.stepsPerDecrease)} />
      <NumberSetting name="settings.stepDown.sleepOnlyBelowLpm" label="Oxygen only when asleep, below (L/min)" schema={s.sleepOnlyBelowLpm} defaultText={practice(d.sleepOnlyBelowLpm)} />
      <NumberSetting name="settings.stepDown.minDaysBetweenStepDowns" label="Days on the current setting before a step down, at least" schema={s.minDaysBetweenStepDowns} defaultText={practice(d.minDaysBetweenStepDowns)} />
      <NumberSetting name="settings.stepDown.studyWithinDays" label="Overnight study supporting a step down, at most (days old)" schema={s.studyWithinDays} defaultText={practice(d.studyWithinDays)} />
      <NumberSetting name="settings.stepDown.readingsWithinDays" label="Spot readings checked from the last (days)" schema={s.readingsWithinDays} defaultText={practice(d.readingsWithinDays)} />
      <NumberSetting name="settings.stepDown.offOxygenObservationDays" label="Days off oxygen before leaving the programme" schema={s.offOxygenObservationDays}
        defaultText={practice(d.offOxygenObservationDays)} />
    </Section>
  );
}

export function OximetrySection() {
  const s = oximetryRulesSchema.shape;
  const d = D.oximetry;
  return (
    <Section title="Overnight oximetry analysis">
      <NumberSetting name="settings.oximetry.minEventSeconds" label="A desaturation counts when it lasts at least (seconds)" schema={s.minEventSeconds}
        defaultText={defaultText(d.minEventSeconds, SOURCES.eventTime)} />
      <NumberSetting name="settings.oximetry.minValidMinutes" label="A study can be judged with at least (minutes of valid recording)" schema={s.minValidMinutes}
        defaultText={defaultText(d.minValidMinutes, SOURCES.minValidTime)} />
    </Section>
  );
}
