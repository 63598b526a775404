import { dateInWords } from '@shared/dates/date-words';
import { EQUIPMENT_KIND_LABELS, ORDER_PURPOSE_LABELS, itemDetail, type OrderItem, type OrderPurpose } from '@shared/schemas/equipment-orders';
import { openTaggedDocument } from '../care-plan/care-plan-writer';

export interface OrderPdfData {
  programmeName: string;
  reference: string;
  purpose: OrderPurpose;
  neededBy: string;
  recipient: string;
  deliveryAddress: string;
  items: OrderItem[];
  cylinderNames: Record<string, string>;
  note: string | null;
  contactPhone: string | null;
  link: string;
  linkExpiresOn: string;
}

/** The order as a tagged A4 PDF (same writer as the care plan): what, where, by when, and how to confirm. */
export function renderOrderPdf(d: OrderPdfData): Promise<Buffer> {
  const { w, finish } = openTaggedDocument({ title: `Equipment order ${d.reference}`, author: d.programmeName });
  w.title(`Equipment order ${d.reference}`);
  w.para(`${ORDER_PURPOSE_LABELS[d.purpose]} for ${d.programmeName}.`);
  w.section('Needed by', () => w.para(dateInWords(d.neededBy), true));
  w.section(d.purpose === 'collection' ? 'Collect from' : 'Deliver to', () => {
    w.para(d.recipient, true);
    for (const line of d.deliveryAddress.split('\n')) w.para(line);
  });
  w.section(d.purpose === 'collection' ? 'Equipment to collect' : 'Equipment', () => {
    w.bullets(d.items.map((i) => {
      const detail = itemDetail(i, d.cylinderNames);
      return `${i.quantity} × ${EQUIPMENT_KIND_LABELS[i.kind]}${detail ? `, ${detail}` : ''}${i.note ? ` (${i.note})` : ''}`;
    }));
  });
  if (d.note) w.section('Notes', () => w.para(d.note!));
  w.section('Confirm the delivery', () => {
    w.para('Open this link to confirm the delivery date, and again to record the delivery (no account needed):');
    w.link(d.link);
    w.para(`The link works for this order only, until ${dateInWords(d.linkExpiresOn)}.`);
    if (d.contactPhone) w.para(`Questions: ${d.programmeName}, ${d.contactPhone}.`);
  });
  return finish();
}
