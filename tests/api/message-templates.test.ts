import type { EntityManager } from 'typeorm';
import { describe, expect, it } from 'vitest';
import { MESSAGE_TEMPLATES, type Channel, type MessageTemplate } from '@shared/schemas/messages';
import { DEFAULT_POLICY_SETTINGS, type PolicySettings } from '@shared/schemas/policy';
import { messageView } from '../../server/modules/reminders/message-content';
import { hasTemplate, renderMessage, templateLanguage } from '../../server/notifications/render';
import type { ReminderContentRepository } from '../../server/db/repositories/reminder-content.repository';
import { reminderRow } from '../helpers/reminders';

// Fictional demo values (Larkmoor scenario).
const PROGRAMME = "Larkmoor Children's Home Oxygen Service";
const PHONE = '01632 960001';
const settings: PolicySettings = { ...DEFAULT_POLICY_SETTINGS, contacts: { phones: [{ label: 'Office', number: PHONE, when: 'Weekdays' }], emergencyNumber: '999' } };
const FAMILY: MessageTemplate[] = ['visit-booked', 'visit-today', 'visit-day-before', 'visit-morning', 'visit-moved', 'visit-cancelled', 'journey-day-before'];
const STAFF: MessageTemplate[] = ['nurse-digest', 'consultant-digest', 'delivery-failed'];
const noDb = undefined as unknown as EntityManager;
const noRepo = undefined as unknown as ReminderContentRepository;

const visitData = (over: Record<string, unknown> = {}) => ({
  babyName: 'Ava', kind: 'home_visit', startsAt: '2026-12-03T10:00:00.000Z', date: '2026-12-03', time: '10:00', timeZone: 'Europe/London',
  staffName: 'Nurse Hale', purpose: 'Spot check and weight', ...over,
});
const journeyData = { babyName: 'Ava', destination: 'High Saddle', departOn: '2026-12-04', flight: false, flowText: '0.5 L/min', cylindersText: '3 × Small portable' };
const failedData = { familyName: 'Rowan Ashby', babyName: 'Ava', template: 'visit-day-before', channel: 'sms', address: '+447700900001', error: 'Unknown number' };

/** The view the delivery service fills a template with; digests read the database, so theirs are built by hand here. */
async function viewFor(template: MessageTemplate, language = 'en', over: Record<string, unknown> = {}) {
  if (template === 'nurse-digest') {
    return {
      recipientName: 'Nurse Hale', programmeName: PROGRAMME, programmePhone: PHONE, dateText: 'Thursday 3 December', checkCount: 1, visitCount: 1,
      checks: [{ babyName: 'Ava Ashby', kindLabel: 'Spot check', dueText: 'due today', address: '1 Mill Lane, Emberly' }],
      visits: [{ timeText: '10:00', babyName: 'Ava Ashby', kindLabel: 'home visit', purpose: 'Spot check and weight', address: '1 Mill Lane, Emberly' }],
      ...over,
    };
  }
  if (template === 'consultant-digest') {
    return {
      recipientName: 'Dr Penrose', programmeName: PROGRAMME, programmePhone: PHONE, count: 2, waitingHours: 24,
      items: [{ babyName: 'Ava Ashby', summary: 'Discharge setting, 0.5 L/min proposed', sinceText: '1 Dec 2026, 09:00' }, { babyName: 'Ned Fallow', summary: 'Step down', sinceText: '1 Dec 2026, 10:00' }],
      ...over,
    };
  }
  const data = template === 'journey-day-before' ? journeyData : template === 'delivery-failed' ? failedData : visitData();
  const row = reminderRow(template, { ...data, ...over }, template === 'delivery-failed' ? { contact_id: null, user_id: '00000000-0000-4000-8000-000000000001', recipient_name: 'Coordinator Vale' } : {});
  return (await messageView({ reminder: row, language, programmeName: PROGRAMME, settings, now: new Date('2026-12-02T17:00:00Z') }, noRepo, noDb))!;
}

const channelsOf = (t: MessageTemplate): Channel[] => (FAMILY.includes(t) ? ['sms', 'email'] : ['email']);
// Any control character; in an e-mail body only line breaks are allowed.
const CONTROL = /\p{Cc}/u;

describe('message templates', () => {
  it('when the list of templates is read, then each is either a family message or a staff message', () => {
    expect([...FAMILY, ...STAFF].sort()).toEqual([...MESSAGE_TEMPLATES].sort());
  });

  it('when a staff template is asked for by SMS, then there is none (staff get e-mail only)', () => {
    for (const t of STAFF) expect(hasTemplate(t, 'sms'), t).toBe(false);
    for (const t of FAMILY) expect(hasTemplate(t, 'sms'), t).toBe(true);
  });

  it.each(MESSAGE_TEMPLATES.flatMap((t) => channelsOf(t).map((c) => [t, c] as const)))('when %s is rendered for %s in English, then every placeholder is filled', async (template, channel) => {
    const out = renderMessage(template, channel, 'en', await viewFor(template));
    expect(out.language).toBe('en');
    for (const part of [out.text, out.subject ?? '', out.html ?? '']) {
      expect(part).not.toMatch(/\{\{|\}\}/);
      // A value that is missing leaves a gap: "a  tomorrow", "( )", " ,".
      expect(part).not.toMatch(/ {2}|\( ?\)| ,| \.(?!\d)/);
    }
    if (channel === 'sms') {
      expect(out.subject).toBeNull();
      expect(out.html).toBeNull();
      expect(out.text).not.toMatch(CONTROL);
    } else {
      expect(out.subject!.length).toBeGreaterThan(10);
      expect(out.subject).not.toMatch(CONTROL);
      expect(out.html).toMatch(/^<!doctype html>.*<p>.*<\/p><\/body><\/html>$/s);
    }
  });

  it('when the family is reminded the day before by SMS, then the text reads in full with the programme number', async () => {
    const out = renderMessage('visit-day-before', 'sms', 'en', await viewFor('visit-day-before'));
    expect(out.text).toBe(
      `Nestflow: Ava has a home visit tomorrow, Thursday 3 December at 10:00 with Nurse Hale. Can't make it? Call ${PROGRAMME} on ${PHONE}. Reply STOP to stop texts.`,
    );
  });

  it('when the programme has no phone number, then the "on …" part is left out rather than left empty', async () => {
    const out = renderMessage('visit-morning', 'sms', 'en', { ...(await viewFor('visit-morning')), programmePhone: null });
    expect(out.text).toBe(`Nestflow: Ava's home visit is today at 10:00 with Nurse Hale. Can't make it? Call ${PROGRAMME}. Reply STOP to stop texts.`);
  });

  it('when the coordinator is told a message failed, then the e-mail names the family, the channel, the address and the reason', async () => {
    const out = renderMessage('delivery-failed', 'email', 'en', await viewFor('delivery-failed'));
    expect(out.subject).toBe('Nestflow: 1 family message could not be delivered');
    expect(out.text).toContain("- Rowan Ashby (Ava's family): Visit tomorrow (family) by text message to +447700900001. Not delivered. Reason given: Unknown number");
    expect(out.text).not.toMatch(/outcome is unknown/);
  });

  it('when the alert gathers a failure and an e-mail of unknown outcome, then it lists both and says to check before sending again', async () => {
    const unknown = { ...failedData, familyName: 'Idris Quell', babyName: 'Noor', channel: 'email', address: 'idris@test.example', outcome: 'unknown', error: 'No mail search' };
    const out = renderMessage('delivery-failed', 'email', 'en', await viewFor('delivery-failed', 'en', { failures: [{ ...failedData, outcome: 'failed' }, unknown] }));
    expect(out.subject).toBe('Nestflow: 2 family messages could not be delivered');
    expect(out.text).toContain("- Idris Quell (Noor's family): Visit tomorrow (family) by e-mail to idris@test.example. Outcome unknown — check before sending again. Reason given: No mail search");
    expect(out.text).toContain('may already have reached the family: check with them before sending it again');
  });
});

describe('languages', () => {
  it('when the family reads Spanish (es-MX), then the Spanish template is used with Spanish words for the visit', async () => {
    expect(templateLanguage('es-MX', 'visit-day-before', 'sms')).toBe('es');
    const out = renderMessage('visit-day-before', 'sms', 'es-MX', await viewFor('visit-day-before', 'es-MX'));
    expect(out.language).toBe('es');
    expect(out.text).toBe(
      `Nestflow: Ava tiene visita a domicilio mañana, jueves, 3 de diciembre a las 10:00 con Nurse Hale. ¿No puede asistir? Llame a ${PROGRAMME} al ${PHONE}. Responda STOP para no recibir SMS.`,
    );
    const mail = renderMessage('visit-cancelled', 'email', 'es', await viewFor('visit-cancelled', 'es'));
    expect(mail.subject).toBe('Cancelada la cita de Ava del jueves, 3 de diciembre');
  });

  it('when the family reads a language without templates (fr), then English is used', async () => {
    expect(templateLanguage('fr', 'visit-moved', 'email')).toBe('en');
    const out = renderMessage('visit-moved', 'email', 'fr', await viewFor('visit-moved'));
    expect(out.language).toBe('en');
    expect(out.subject).toBe("New time for Ava's home visit: Thursday 3 December at 10:00");
  });

  it('when Spanish has no template for a message (journeys), then English is used for that message only', () => {
    expect(templateLanguage('es', 'journey-day-before', 'sms')).toBe('en');
    expect(templateLanguage('es', 'visit-morning', 'sms')).toBe('es');
  });

  it('when the stored language is not a language code (a path), then no file outside the templates is read: English', () => {
    expect(templateLanguage('../../etc', 'visit-morning', 'sms')).toBe('en');
    expect(templateLanguage('en/../es', 'visit-morning', 'sms')).toBe('en');
  });
});

describe('values cannot change the message around them', () => {
  it('when a value carries CR/LF and a header, then the subject stays one line and no body line starts with the header', async () => {
    const view = await viewFor('visit-day-before', 'en', { babyName: 'Ava\r\nBcc: x@y' });
    const out = renderMessage('visit-day-before', 'email', 'en', view);
    expect(out.subject).toBe("Ava Bcc: x@y's home visit tomorrow at 10:00");
    expect(out.subject).not.toMatch(/[\r\n]/);
    expect(out.text).not.toMatch(/^Bcc:/m);
    expect(out.html).not.toMatch(/<br>Bcc:|<p>Bcc:/);
  });

  it('when a value looks like a placeholder, then it is printed as it is and not filled in', async () => {
    const view = await viewFor('visit-morning', 'en', { purpose: '{{programmeName}} {{#programmePhone}}x{{/programmePhone}}' });
    const mail = renderMessage('visit-morning', 'email', 'en', view);
    expect(mail.text).toContain('What it is for: {{programmeName}} {{#programmePhone}}x{{/programmePhone}}\n');
    expect(mail.html).toContain('What it is for: {{programmeName}} {{#programmePhone}}x{{&#x2F;programmePhone}}</p>');
    const sms = renderMessage('visit-morning', 'sms', 'en', { ...view, babyName: '{{programmeName}}' });
    expect(sms.text.startsWith("Nestflow: {{programmeName}}'s home visit")).toBe(true);
  });

  it('when a value carries markup, then the HTML part shows it as text and the plain part keeps it as typed', async () => {
    const view = await viewFor('visit-day-before', 'en', { purpose: '<script>alert("x")</script>', staffName: 'Hale & Co' });
    const out = renderMessage('visit-day-before', 'email', 'en', view);
    expect(out.html).not.toContain('<script>');
    expect(out.html).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;&#x2F;script&gt;');
    expect(out.html).toContain('with Hale &amp; Co.');
    expect(out.text).toContain('What it is for: <script>alert("x")</script>');
  });

  it('when values carry control characters, then the SMS has none', async () => {
    const view = await viewFor('visit-moved', 'en', { babyName: 'A\u0007va', staffName: 'Nurse\tHale\u0000', purpose: 'line\nbreak' });
    const out = renderMessage('visit-moved', 'sms', 'en', view);
    expect(out.text).not.toMatch(CONTROL);
    expect(out.text).toContain("A va's home visit has moved");
    expect(out.text).toContain('with Nurse Hale .');
  });
});
