import { dayWords, fromTo, joinWords, list, num, obj, str, type Details } from './audit-format';
import { numberInWords } from '../format/number-words';

type People = Readonly<Record<string, string>>;

/** Where the home is, as entered: an elevation in m or ft, or a measured pressure. */
function placeWords(value: unknown): string {
  const place = obj(value);
  if (!place) return 'nothing';
  if (num(place.elevationM) !== null) return `${numberInWords(num(place.elevationM)!)} m`;
  if (num(place.elevationFt) !== null) return `${numberInWords(num(place.elevationFt)!)} ft`;
  if (num(place.pressureMmHg) !== null) return `measured ${num(place.pressureMmHg)} mmHg`;
  return 'a new place';
}

const person = (id: unknown, people: People) => (str(id) ? people[str(id)!] || 'someone no longer listed' : 'nobody');

const FIELDS: Record<string, (from: unknown, to: unknown, people: People) => string> = {
  weightKg: (a, b) => `weight ${fromTo(a, b, 'kg')}`,
  weightDate: (a, b) => `weighing date ${str(a) ? `from ${dayWords(a)} ` : ''}to ${dayWords(b)}`,
  homeAddress: (a, b) => `home address ${fromTo(a, b)}`,
  homeLocation: (a, b) => `home elevation or pressure ${obj(a) ? `from ${placeWords(a)} ` : ''}to ${placeWords(b)}`,
  homeSource: (a, b) => `home oxygen source ${fromTo(a, b)}`,
  homeO2Percent: (a, b) => `home oxygen ${fromTo(a, b, '%')}`,
  nurseId: (a, b, people) => `nurse from ${person(a, people)} to ${person(b, people)}`,
  consultantId: (a, b, people) => `consultant from ${person(a, people)} to ${person(b, people)}`,
};

/** "weight from 2.4 kg to 2.9 kg, nurse from Ada Pennick to …" from `{ changes: { field: { from, to } } }`. */
export function recordChanges(details: Details, people: People): string {
  const changes = obj(details.changes) ?? {};
  const words = Object.entries(changes).map(([field, change]) => {
    const c = obj(change) ?? {};
    const describe = FIELDS[field];
    return describe ? describe(c.from, c.to, people) : `${field.replace(/([A-Z])/g, ' $1').toLowerCase()} changed`;
  });
  return words.length ? words.join(', ') : 'nothing changed';
}

interface ContactLine { name: string; relation: string | null; preferredChannel: string | null; consentSms: unknown; consentEmail: unknown }
const contactsOf = (value: unknown): ContactLine[] =>
  list(value).map((c) => obj(c) ?? {}).map((c) => ({
    name: str(c.name) ?? 'someone', relation: str(c.relation), preferredChannel: str(c.preferredChannel), consentSms: c.consentSms, consentEmail: c.consentEmail,
  }));
const who = (c: ContactLine) => (c.relation ? `${c.name} (${c.relation})` : c.name);
const channel = (value: string | null) => (value === 'sms' ? 'SMS' : value === 'email' ? 'e-mail' : 'nothing');
const consent = (label: string, from: unknown, to: unknown) => (from === to ? null : `${label} consent ${to === true ? 'given' : 'withdrawn'}`);

/** Who was added or removed, and for those kept, what changed about how they are reached. */
export function contactsWords(details: Details): string {
  if (!Array.isArray(details.after)) return 'the list was replaced';
  const before = contactsOf(details.before);
  const after = contactsOf(details.after);
  const parts: string[] = [];
  const added = after.filter((c) => !before.some((b) => b.name === c.name));
  const removed = before.filter((b) => !after.some((c) => c.name === b.name));
  if (added.length) parts.push(`added ${joinWords(added.map(who))}`);
  if (removed.length) parts.push(`removed ${joinWords(removed.map(who))}`);
  for (const c of after) {
    const b = before.find((x) => x.name === c.name);
    if (!b) continue;
    const changes = [
      b.relation !== c.relation ? `relation ${fromTo(b.relation, c.relation)}` : null,
      b.preferredChannel !== c.preferredChannel ? `prefers ${channel(c.preferredChannel)} (was ${channel(b.preferredChannel)})` : null,
      consent('SMS', b.consentSms, c.consentSms),
      consent('e-mail', b.consentEmail, c.consentEmail),
    ].filter((x): x is string => x !== null);
    if (changes.length) parts.push(`${c.name}: ${changes.join(', ')}`);
  }
  return parts.length ? parts.join('; ') : `no change to names, channels or consent (${after.length} ${after.length === 1 ? 'contact' : 'contacts'})`;
}

const PREFERENCE_WORDS: Record<string, (d: Details) => string> = {
  preferredChannel: (d) => `prefers ${channel(str(d.preferredChannel))}`,
  consentSms: (d) => `SMS consent ${d.consentSms === true ? 'given' : 'withdrawn'}`,
  consentEmail: (d) => `e-mail consent ${d.consentEmail === true ? 'given' : 'withdrawn'}`,
  remindersEnabled: (d) => `visit reminders ${d.remindersEnabled === true ? 'on' : 'off'}`,
  language: (d) => `language ${str(d.language) ?? 'changed'}`,
  mobile: () => 'mobile number changed',
  email: () => 'e-mail address changed',
};

/** The family's own changes: the switches' new values; addresses are never copied into the trail, only named. */
export function preferencesWords(details: Details): string {
  const changed = list(details.changed).map(String);
  if (!changed.length) return 'nothing changed';
  return changed.map((key) => PREFERENCE_WORDS[key]?.(details) ?? `${key.replace(/([A-Z])/g, ' $1').toLowerCase()} changed`).join(', ');
}
