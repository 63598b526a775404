import { dateInWords } from '@shared/dates/date-words';
import { formatPhone } from '@shared/phone/phone';
import type { PolicySettings } from '@shared/schemas/policy';
import type { EquipmentOrderEntity } from '../../db/entities/equipment-order.entity';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { MailSender } from '../../notifications/mail-sender';
import { renderOrderPdf } from './order.pdf';
import { linkExpiry, makeSupplierToken } from './supplier-link';

export interface LinkConfig { publicUrl: string; secret: string; days: number }

// Control characters (CR/LF included) become spaces, so no value can start a new line or header.
const plain = (value: string) => value.replace(/[\p{Cc}\u2028\u2029]+/gu, ' ');

/** The name on the door, not the baby's: the supplier needs no more to deliver. */
export const recipientOf = (infant: Pick<InfantEntity, 'familyName'>) => `The ${infant.familyName} family`;

export const cylinderNamesOf = (settings: PolicySettings) => Object.fromEntries(settings.supply.cylinders.map((c) => [c.id, c.name]));

export function programmePhone(settings: PolicySettings): string | null {
  const first = settings.contacts.phones[0];
  return first ? `${formatPhone(first.number, settings.country)} (${first.label})` : null;
}

export function supplierLink(cfg: LinkConfig, order: Pick<EquipmentOrderEntity, 'id' | 'neededBy'>) {
  const expiresAt = linkExpiry(order.neededBy, cfg.days);
  return { url: `${cfg.publicUrl}/supplier/orders/${makeSupplierToken(cfg.secret, order.id, expiresAt)}`, expiresAt };
}

/** E-mails the order with its PDF to the supplier's order address; throws what the mail sender throws. */
export async function mailOrder(mail: MailSender, cfg: LinkConfig, o: EquipmentOrderEntity, infant: InfantEntity, settings: PolicySettings, programmeName: string) {
  const to = settings.supplier.orderEmail;
  const link = supplierLink(cfg, o);
  const pdf = await renderOrderPdf({
    programmeName, reference: o.reference, purpose: o.purpose, neededBy: o.neededBy, recipient: recipientOf(infant), deliveryAddress: o.deliveryAddress,
    items: o.items, cylinderNames: cylinderNamesOf(settings), note: o.note, contactPhone: programmePhone(settings), link: link.url,
    linkExpiresOn: link.expiresAt.toISOString().slice(0, 10),
  });
  const what = o.purpose === 'collection' ? 'Collection' : 'Equipment order';
  await mail.send({
    to,
    subject: plain(`${what} ${o.reference} from ${programmeName}: needed by ${dateInWords(o.neededBy)}`),
    text: [
      `Hello${settings.supplier.name ? ` ${plain(settings.supplier.name)}` : ''},`,
      '',
      `${plain(programmeName)} asks for the ${o.purpose === 'collection' ? 'collection' : 'equipment'} in the attached order ${o.reference}, needed by ${dateInWords(o.neededBy)}.`,
      'Please confirm the delivery date, and later the delivery, with this link (no account needed):',
      '',
      link.url,
      '',
      `The link works for this order only, until ${dateInWords(link.expiresAt.toISOString())}.`,
      programmePhone(settings) ? `Questions: ${programmePhone(settings)}.` : '',
      '',
      '— Nestflow',
    ].join('\n'),
    attachments: [{ filename: `order-${o.reference.toLowerCase()}.pdf`, content: pdf, contentType: 'application/pdf' }],
  });
  return { to };
}

/** A short notice that an order already sent is off; the link then shows it as cancelled. */
export async function mailCancellation(mail: MailSender, o: EquipmentOrderEntity, settings: PolicySettings, programmeName: string) {
  await mail.send({
    to: o.supplierEmail ?? settings.supplier.orderEmail,
    subject: plain(`Cancelled: order ${o.reference} from ${programmeName}`),
    text: `${plain(programmeName)} has cancelled order ${o.reference} (needed by ${dateInWords(o.neededBy)}). Please do not deliver it.\n\n— Nestflow\n`,
  });
}
