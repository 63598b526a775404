import type { OrderPurpose, OrderStatus } from '../schemas/equipment-orders';
import type { ItemState } from './readiness';

/** The default checklist items the baby's equipment orders answer (shared/schemas/discharge-policy.ts). */
export const EQUIPMENT_ORDERED_KEY = 'equipment_ordered';
export const EQUIPMENT_INSTALLED_KEY = 'equipment_installed';

/** What the checklist needs to know of one order; `deliveredOn` is the delivery's day in the programme's time zone. */
export interface OrderFact {
  id: string;
  reference: string;
  purpose: OrderPurpose;
  status: OrderStatus;
  /** When the e-mail was handed over (ISO), null if never sent. */
  sentAt: string | null;
  deliveredAt: string | null;
  deliveredOn: string | null;
}

/** An item done by an order: which order, in what status, and when (ISO instant and the programme's day). */
export interface OrderTick {
  key: string;
  /** What the order did: it reached the supplier, or the supplier delivered it. */
  event: 'sent' | 'delivered';
  orderId: string;
  reference: string;
  status: OrderStatus;
  at: string;
  on: string;
}

// A collection takes equipment away; only a first delivery or a change of equipment brings it home.
const BRINGS_EQUIPMENT: readonly OrderPurpose[] = ['delivery', 'change'];
const SENT_OR_LATER: readonly OrderStatus[] = ['sent', 'confirmed', 'delivered'];

const earliest = <T>(rows: T[], at: (r: T) => string) => [...rows].sort((a, b) => at(a).localeCompare(at(b)))[0];

/**
 * The items the orders tick: "ordered" once an order that brings equipment is with the supplier (sent, confirmed
 * or delivered, never a cancelled one); "installed" once such an order is delivered, on or before the discharge
 * date when one is set. The earliest qualifying order answers each item.
 */
export function ticksFromOrders(orders: readonly OrderFact[], dischargedOn: string | null, sentOn: (iso: string) => string): OrderTick[] {
  const bringing = orders.filter((o) => BRINGS_EQUIPMENT.includes(o.purpose));
  const ticks: OrderTick[] = [];
  const sent = bringing.filter((o): o is OrderFact & { sentAt: string } => SENT_OR_LATER.includes(o.status) && o.sentAt !== null);
  if (sent.length) {
    const o = earliest(sent, (r) => r.sentAt);
    ticks.push({ key: EQUIPMENT_ORDERED_KEY, event: 'sent', orderId: o.id, reference: o.reference, status: o.status, at: o.sentAt, on: sentOn(o.sentAt) });
  }
  const delivered = bringing.filter((o): o is OrderFact & { deliveredAt: string; deliveredOn: string } =>
    o.status === 'delivered' && o.deliveredAt !== null && o.deliveredOn !== null && (dischargedOn === null || o.deliveredOn <= dischargedOn));
  if (delivered.length) {
    const o = earliest(delivered, (r) => r.deliveredAt);
    ticks.push({ key: EQUIPMENT_INSTALLED_KEY, event: 'delivered', orderId: o.id, reference: o.reference, status: o.status, at: o.deliveredAt, on: o.deliveredOn });
  }
  return ticks;
}

/** The stored states with the orders' ticks added where no hand tick stands: what readiness counts. */
export function withOrderTicks<T extends ItemState>(states: readonly T[], ticks: readonly OrderTick[]): ItemState[] {
  const handDone = new Set(states.filter((s) => s.done).map((s) => s.key));
  return [...states, ...ticks.filter((t) => !handDone.has(t.key)).map((t) => ({ key: t.key, done: true, evidence: { date: t.on } }))];
}
