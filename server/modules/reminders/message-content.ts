import type { EntityManager } from 'typeorm';
import { PRESCRIPTION_REASON_LABELS, type PrescriptionReason } from '@shared/schemas/prescriptions';
import { CHECK_KIND_LABELS } from '@shared/schemas/schedule';
import { MESSAGE_TEMPLATE_LABELS, type MessageTemplate } from '@shared/schemas/messages';
import type { PolicySettings } from '@shared/schemas/policy';
import { formatPhone } from '@shared/phone/phone';
import type { ReminderContentRepository } from '../../db/repositories/reminder-content.repository';
import type { ReminderRow } from '../../db/repositories/reminders.repository';

const KIND_LABELS: Record<string, Record<string, string>> = {
  en: { home_visit: 'home visit', clinic_review: 'clinic review' },
  es: { home_visit: 'visita a domicilio', clinic_review: 'revisión en la clínica' },
};

// Plain 'en' reads as British English ("Thursday 3 December"); a regional code such as en-US is kept as given.
const locale = (language: string) => (language === 'en' ? 'en-GB' : language);

function dateText(iso: string, timeZone: string, language: string): string {
  return new Intl.DateTimeFormat(locale(language), { weekday: 'long', day: 'numeric', month: 'long', timeZone }).format(new Date(iso));
}

/** A plain date (YYYY-MM-DD) in words, without any time zone shift. */
function plainDateText(date: string, language: string): string {
  return new Intl.DateTimeFormat(locale(language), { weekday: 'long', day: 'numeric', month: 'long', timeZone: 'UTC' }).format(new Date(`${date}T12:00:00Z`));
}

export interface ContentContext {
  reminder: ReminderRow;
  language: string;
  programmeName: string;
  settings: PolicySettings;
  now: Date;
}

/**
 * The values a template is filled with, read when the message goes (a digest lists what is due at that moment).
 * Null means there is nothing to say any more, and the message is skipped.
 */
export async function messageView(ctx: ContentContext, content: ReminderContentRepository, m: EntityManager): Promise<Record<string, unknown> | null> {
  const { reminder: r, language } = ctx;
  const d = r.data as Record<string, string | boolean | number>;
  const common = {
    recipientName: r.recipient_name, programmeName: ctx.programmeName, programmePhone: ctx.settings.contacts.phones[0] ? formatPhone(ctx.settings.contacts.phones[0].number, ctx.settings.country) : null,
  };
  const lang = language.split('-')[0];
  switch (r.template as MessageTemplate) {
    case 'visit-booked':
    case 'visit-today':
    case 'visit-day-before':
    case 'visit-morning':
    case 'visit-moved':
    case 'visit-cancelled':
      return {
        ...common, babyName: d.babyName, kindLabel: (KIND_LABELS[lang] ?? KIND_LABELS.en)[String(d.kind)], staffName: d.staffName,
        purpose: d.purpose, timeText: d.time, dateText: dateText(String(d.startsAt), String(d.timeZone), language),
      };
    case 'journey-day-before':
      return { ...common, ...d, dateText: plainDateText(String(d.departOn), language) };
    case 'delivery-failed': {
      // One alert lists every item gathered in its period; a row written before alerts were gathered holds one.
      const raw = r.data.failures;
      const failures = (Array.isArray(raw) ? raw : [d]) as Array<Record<string, string>>;
      const items = failures.map((f) => ({
        ...f,
        templateLabel: MESSAGE_TEMPLATE_LABELS[f.template as MessageTemplate] ?? f.template,
        channelLabel: f.channel === 'sms' ? 'text message' : 'e-mail',
        outcomeText: f.outcome === 'unknown' ? 'Outcome unknown — check before sending again' : 'Not delivered',
      }));
      return { ...common, count: items.length, messagesWord: items.length === 1 ? 'message' : 'messages', items, anyUnknown: failures.some((f) => f.outcome === 'unknown') };
    }
    case 'nurse-digest': {
      const today = String(d.date);
      const checks = await content.nurseDigestChecks(r.user_id, r.programme_id, today, m);
      const visits = await content.nurseDigestVisits(r.user_id, r.programme_id, today, m);
      if (checks.length === 0 && visits.length === 0) return null;
      return {
        ...common, dateText: plainDateText(today, 'en'), checkCount: checks.length, visitCount: visits.length,
        checks: checks.map((c) => ({
          babyName: `${c.given_name} ${c.family_name}`, kindLabel: CHECK_KIND_LABELS[c.kind], address: c.home_address,
          dueText: c.due_date < today ? `overdue since ${plainDateText(c.due_date, 'en')}` : 'due today',
        })),
        visits: visits.map((v) => ({ timeText: v.local_time, babyName: `${v.given_name} ${v.family_name}`, kindLabel: KIND_LABELS.en[v.kind], purpose: v.purpose, address: v.home_address })),
      };
    }
    case 'consultant-digest': {
      const hours = ctx.settings.reminders.signOffWaitingHours;
      // Proposed settings and journey checks alike wait for a consultant's decision.
      const items = await content.consultantDigestItems(r.programme_id, new Date(ctx.now.getTime() - hours * 3_600_000), m);
      if (items.length === 0) return null;
      return {
        ...common, count: items.length, waitingHours: hours,
        items: items.map((p) => ({
          babyName: `${p.given_name} ${p.family_name}`,
          summary: p.destination !== null
            ? `journey check for a trip to ${p.destination}`
            : `${PRESCRIPTION_REASON_LABELS[p.reason as PrescriptionReason] ?? p.reason}${p.proposed_flow_lpm === null ? '' : `, ${Number(p.proposed_flow_lpm)} L/min proposed`}`,
          sinceText: new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: r.time_zone }).format(new Date(p.since)),
        })),
      };
    }
    default:
      return null;
  }
}
