import { DEFAULT_COUNTRY, formatPhone, isCountryCode } from '@shared/phone/phone';
import type { Preferences } from '@shared/schemas/preferences';
import { CHANNEL_WORDS, languageLabel } from './preference-values';
import { REMINDERS_OFF_WORDS } from './reminders-switch';

function agreedText({ consentSms, consentEmail }: Preferences): string {
  if (consentSms && consentEmail) return 'Text messages and e-mails';
  if (consentSms) return 'Text messages only';
  if (consentEmail) return 'E-mails only';
  return 'Nothing yet: we cannot send you messages';
}

/** What we hold now, as saved on the server, in plain words. */
export function PreferencesSummary({ preferences }: { preferences: Preferences }) {
  const rows: [string, string][] = [
    ['Visit reminders', preferences.remindersEnabled ? 'On' : `Off. ${REMINDERS_OFF_WORDS}`],
    ['Mobile number', preferences.mobile ? formatPhone(preferences.mobile, isCountryCode(preferences.country) ? preferences.country : DEFAULT_COUNTRY) : 'Not given'],
    ['E-mail address', preferences.email ?? 'Not given'],
    ['Best way to reach you', CHANNEL_WORDS[preferences.preferredChannel]],
    ['You agree to get', agreedText(preferences)],
    ['Language', languageLabel(preferences.language)],
  ];
  return (
    <section aria-labelledby="saved-heading" className="rounded-2xl border border-surface-200 bg-surface-0 p-5 shadow-sm">
      <h2 id="saved-heading" className="text-2xl font-bold text-ink-900">What we have for you now</h2>
      <dl aria-labelledby="saved-heading" className="mt-3 flex flex-col gap-3">
        {rows.map(([term, value]) => (
          <div key={term} className="flex flex-col">
            <dt className="text-lg text-ink-700">{term}</dt>
            <dd className="text-xl font-semibold break-words text-ink-900">{value}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-3 text-lg text-ink-700">Reminder times follow your local time ({preferences.timeZone}).</p>
    </section>
  );
}
