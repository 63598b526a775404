import { addDays } from '@shared/clinical/dates';
import type { OrderItem, OrderStatus } from '@shared/schemas/equipment-orders';
import { localParts } from '@shared/reminders/timing';
import type { AppDeps } from '../server/deps';
import { historyEntry } from '../server/modules/equipment-orders/orders.mapper';
import { insertOrder } from '../server/modules/equipment-orders/insert-order';

const HOME: OrderItem[] = [
  { kind: 'concentrator', quantity: 1, flowMinLpm: 0.1, flowMaxLpm: 2 },
  { kind: 'static_cylinder', quantity: 2, size: 'large-home' },
  { kind: 'portable_cylinder', quantity: 4, size: 'small-portable' },
  { kind: 'spares', quantity: 2, note: 'Size 0 nasal cannulas and 7 m tubing' },
];

/**
 * Demo orders to the fictional supplier, one at each status, written as the orders service and the supplier's link
 * would leave them (history and audit included). No e-mail is sent: the seed runs with no mail server.
 */
export async function seedEquipmentOrders(deps: AppDeps, programmeSlug: string): Promise<number> {
  const { ds, repos } = deps;
  const already = await ds.query(`SELECT 1 FROM equipment_orders o JOIN programmes p ON p.id = o.programme_id WHERE p.slug = $1 LIMIT 1`, [programmeSlug]);
  if (already.length) return 0;
  const [coordinator] = await ds.query(`SELECT id, programme_id FROM users WHERE email = $1`, [`coordinator@${programmeSlug}.example`]);
  const programme = await repos.programmes.findBySlug(programmeSlug);
  if (!coordinator || !programme) return 0;
  const babies: Array<{ id: string }> = await ds.query(
    `SELECT id FROM infants WHERE programme_id = $1 AND status IN ('on_oxygen','stepping_down','preparing','awaiting_signoff') ORDER BY family_name, given_name LIMIT 6`, [programme.id]);
  const today = localParts(new Date(), programme.timeZone).date;
  const plans: Array<{ status: OrderStatus; neededBy: string; note?: string }> = [
    { status: 'drafted', neededBy: addDays(today, 6) },
    { status: 'sent', neededBy: addDays(today, 3) },
    // Sent four days ago and needed yesterday, never confirmed: the overview flags it.
    { status: 'sent', neededBy: addDays(today, -1) },
    { status: 'failed', neededBy: addDays(today, 4), note: 'Mail rejected: 550 Requested action not taken: mailbox unavailable' },
    { status: 'confirmed', neededBy: addDays(today, 2) },
    { status: 'delivered', neededBy: addDays(today, -10) },
    { status: 'cancelled', neededBy: addDays(today, 5), note: 'Discharge postponed by a week' },
  ];
  const supplierEmail = 'orders@fenwold-gases.example';
  let n = 0;
  for (const [i, plan] of plans.entries()) {
    const baby = babies[i % babies.length];
    if (!baby) break;
    await ds.transaction(async (m) => {
      const infant = (await repos.infants.findForUpdate(baby.id, m))!;
      const start = new Date(Date.now() - (10 - i) * 86_400_000);
      const order = await insertOrder(repos, m, infant, { purpose: 'delivery', items: HOME, neededBy: plan.neededBy, deliveryAddress: infant.homeAddress, note: null, automaticReason: null },
        { id: coordinator.id, ip: null, kind: 'staff' }, start);
      const step = async (status: OrderStatus, by: 'staff' | 'supplier', note: string | null, details: Record<string, unknown> = {}) => {
        order.status = status;
        order.history = [...order.history, historyEntry(status, new Date(start.getTime() + order.history.length * 3_600_000), by === 'staff' ? coordinator.id : null, by, note)];
        const action = status === 'sent' ? 'equipment_order.sent' : status === 'failed' ? 'equipment_order.send_failed' : status === 'confirmed' ? 'equipment_order.confirmed'
          : status === 'delivered' ? 'equipment_order.delivered' : 'equipment_order.cancelled';
        await repos.audit.append({ programmeId: infant.programmeId, actorId: by === 'staff' ? coordinator.id : null, action, entityType: 'infant', entityId: infant.id,
          details: { orderId: order.id, reference: order.reference, ...(by === 'supplier' ? { by: 'supplier' } : {}), ...details } }, m);
      };
      if (plan.status === 'failed') {
        order.failureReason = plan.note ?? null;
        await step('failed', 'staff', plan.note ?? null, { reason: plan.note });
      } else if (plan.status !== 'drafted') {
        order.supplierEmail = supplierEmail;
        await step('sent', 'staff', `to ${supplierEmail}`, { to: supplierEmail });
        if (plan.status === 'confirmed' || plan.status === 'delivered') {
          order.deliveryOn = addDays(plan.neededBy, -1);
          await step('confirmed', 'supplier', `delivery on ${order.deliveryOn}`, { deliveryOn: order.deliveryOn, neededBy: plan.neededBy });
        }
        if (plan.status === 'delivered') {
          order.deliveredAt = new Date(`${order.deliveryOn}T11:00:00Z`);
          await step('delivered', 'supplier', null, { deliveryOn: order.deliveryOn });
        }
        if (plan.status === 'cancelled') await step('cancelled', 'staff', plan.note ?? null, { reason: plan.note });
      }
      await repos.equipmentOrders.save(order, m);
    });
    n++;
  }
  return n;
}
