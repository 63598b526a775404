import { useState } from 'react';
import { useFormContext } from 'react-hook-form';
import { MESSAGE_LANGUAGES } from '@shared/schemas/preferences';
import { OTHER_HOME_LANGUAGES } from '@shared/family/languages';
import { SelectField } from '../../../components/ui/field';
import type { ContactValues } from './enrol-values';
import { errorText } from './form-helpers';

const englishNames = (() => {
  try {
    return new Intl.DisplayNames(['en-GB'], { type: 'language' });
  } catch {
    return null;
  }
})();
const languageName = (code: string) => englishNames?.of(code) ?? code;

const allZones = (() => {
  try {
    return Intl.supportedValuesOf('timeZone');
  } catch {
    return [];
  }
})();

/** "America/Buenos_Aires" → "America / Buenos Aires": the identifier, easier to read. */
export const zoneLabel = (zone: string) => zone.replace(/_/g, ' ').replace(/\//g, ' / ');

/** The programme's zone and the one already stored first (a family is nearly always there), then every zone. */
export function timeZoneChoices(programmeZone: string, current: string | undefined): { likely: string[]; others: string[] } {
  const likely = [...new Set([programmeZone, current].filter((zone): zone is string => Boolean(zone)))];
  return { likely, others: allZones.filter((zone) => !likely.includes(zone)) };
}

/** Languages with messages first, then the others (messages in English); a stored code outside both stays choosable. */
export function languageChoices(current: string | undefined): { withMessages: { code: string; label: string }[]; others: { code: string; label: string }[] } {
  const withMessages = MESSAGE_LANGUAGES.map(({ code, label }) => ({ code, label: code === 'en' ? label : `${label} (${languageName(code)})` }));
  const known = new Set<string>([...withMessages.map((l) => l.code), ...OTHER_HOME_LANGUAGES]);
  const codes = [...OTHER_HOME_LANGUAGES, ...(current && !known.has(current) ? [current] : [])];
  const others = codes.map((code) => ({ code, label: `${languageName(code)} — messages in English` })).sort((a, b) => a.label.localeCompare(b.label));
  return { withMessages, others };
}

/** Language and time zone of one family contact, as choices rather than free text. */
export function ContactLocaleFields({ index, defaultTimeZone }: { index: number; defaultTimeZone: string }) {
  const { getValues, register, formState: { errors } } = useFormContext<{ contacts: ContactValues[] }>();
  // The lists are built from the values the contact arrived with: rebuilt on each choice, the chosen option would
  // move between groups and the browser would lose the selection.
  // Built once as elements too: the zone list has some 400 options, and the form re-renders on every keystroke.
  const [{ languageOptions, zoneOptions }] = useState(() => {
    const languages = languageChoices(getValues(`contacts.${index}.language`));
    const zones = timeZoneChoices(defaultTimeZone, getValues(`contacts.${index}.timeZone`));
    return {
      languageOptions: (
        <>
          <optgroup label="Messages in this language">
            {languages.withMessages.map((option) => <option key={option.code} value={option.code}>{option.label}</option>)}
          </optgroup>
          <optgroup label="Other languages">
            {languages.others.map((option) => <option key={option.code} value={option.code}>{option.label}</option>)}
          </optgroup>
        </>
      ),
      zoneOptions: (
        <>
          <optgroup label="Most likely">
            {zones.likely.map((zone) => <option key={zone} value={zone}>{zoneLabel(zone)}</option>)}
          </optgroup>
          <optgroup label="All time zones">
            {zones.others.map((zone) => <option key={zone} value={zone}>{zoneLabel(zone)}</option>)}
          </optgroup>
        </>
      ),
    };
  });
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <SelectField label="Language" hint="Messages go out in this language where we have them" error={errorText(errors, `contacts.${index}.language`)}
        {...register(`contacts.${index}.language`)}>
        {languageOptions}
      </SelectField>
      <SelectField label="Time zone" hint="Where the family lives; visit times and reminders follow it" error={errorText(errors, `contacts.${index}.timeZone`)}
        {...register(`contacts.${index}.timeZone`)}>
        {zoneOptions}
      </SelectField>
    </div>
  );
}
