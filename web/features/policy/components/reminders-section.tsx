import { DEFAULT_POLICY_SETTINGS, reminderRulesSchema } from '@shared/schemas/policy';
import { NumberSetting } from './policy-field';
import { TextSetting } from './policy-list-field';
import { defaultText, Section } from './policy-sections';
import { SOURCES } from './policy-sources';

const d = DEFAULT_POLICY_SETTINGS.reminders;
const practice = (value: string | number) => defaultText(value, SOURCES.commonPractice);

/** Every time here is the recipient's own local time; the worker converts per person. */
export function RemindersSection() {
  return (
    <Section title="Reminders">
      <p className="text-ink-700 sm:col-span-2">
        Times are each person’s own local time. A message that would start in quiet hours waits until they end.
      </p>
      <TextSetting name="settings.reminders.dayBeforeAt" type="time" label="Families: reminder the day before a visit, at"
        hint={practice(d.dayBeforeAt)} className="max-w-40" />
      <TextSetting name="settings.reminders.morningOfAt" type="time" label="Families: reminder on the morning of a visit, at"
        hint={practice(d.morningOfAt)} className="max-w-40" />
      <TextSetting name="settings.reminders.quietStart" type="time" label="Quiet hours start at" hint={defaultText(d.quietStart)} className="max-w-40" />
      <TextSetting name="settings.reminders.quietEnd" type="time" label="Quiet hours end at" hint={defaultText(d.quietEnd)} className="max-w-40" />
      <TextSetting name="settings.reminders.staffDigestAt" type="time" label="Staff morning list at" hint={practice(d.staffDigestAt)}
        className="max-w-40" />
      <NumberSetting name="settings.reminders.signOffWaitingHours" label="Tell consultants about proposals waiting longer than (hours)"
        schema={reminderRulesSchema.shape.signOffWaitingHours} defaultText={practice(d.signOffWaitingHours)} />
      <NumberSetting name="settings.reminders.failureAlertPeriodMinutes" label="Tell coordinators about failed family messages, gathered every (minutes)"
        schema={reminderRulesSchema.shape.failureAlertPeriodMinutes} defaultText={practice(d.failureAlertPeriodMinutes)} />
    </Section>
  );
}
