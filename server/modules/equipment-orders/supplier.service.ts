import type { DataSource, EntityManager } from 'typeorm';
import { dialable, formatPhone } from '@shared/phone/phone';
import { EQUIPMENT_KIND_LABELS, itemDetail, type SupplierOrderView } from '@shared/schemas/equipment-orders';
import type { EquipmentOrderEntity } from '../../db/entities/equipment-order.entity';
import type { AppRepos } from '../../deps';
import { systemClock, type Clock } from '../../lib/clock';
import { todayIn } from '../../lib/dates';
import { AppError, ConflictError, ValidationError } from '../../lib/errors';
import { historyEntry } from './orders.mapper';
import { cylinderNamesOf, recipientOf } from './order-mail';
import { readSupplierToken } from './supplier-link';

/** Every bad link answers the same way, and says nothing about the order. */
export class LinkNotValidError extends AppError {
  constructor(reason: 'invalid' | 'expired') {
    super(404, reason === 'expired' ? 'link_expired' : 'link_invalid', reason === 'expired'
      ? 'This link has expired. Please call the home oxygen team for a new one.'
      : 'This link is not valid. Check that it was copied whole, or call the home oxygen team.');
  }
}

export function createSupplierService(ds: DataSource, repos: AppRepos, secret: string, clock: Clock = systemClock) {
  function orderIdOf(token: string) {
    const check = readSupplierToken(secret, token, clock.now());
    if (!check.ok) throw new LinkNotValidError(check.reason);
    return check;
  }

  async function view(o: EquipmentOrderEntity, expiresAt: Date, m?: EntityManager): Promise<SupplierOrderView> {
    const infant = await repos.infants.findVisible(o.infantId, { sql: 'i.programme_id = :orderProgramme', params: { orderProgramme: o.programmeId } }, m);
    const [programme, policy] = await Promise.all([repos.programmes.findById(o.programmeId), repos.policies.current(o.programmeId, m)]);
    const s = policy.settings;
    const names = cylinderNamesOf(s);
    const phone = s.contacts.phones[0];
    return {
      reference: o.reference, purpose: o.purpose, status: o.status, neededBy: o.neededBy, deliveryAddress: o.deliveryAddress,
      recipient: infant ? recipientOf(infant) : '', note: o.note, deliveryOn: o.deliveryOn, deliveredAt: o.deliveredAt ? o.deliveredAt.toISOString() : null,
      items: o.items.map((i) => ({ kind: i.kind, label: EQUIPMENT_KIND_LABELS[i.kind], quantity: i.quantity, detail: itemDetail(i, names), note: i.note ?? null })),
      programme: {
        name: programme?.name ?? '',
        phone: phone ? formatPhone(phone.number, s.country) : null,
        phoneDial: phone ? dialable(phone.number, s.country) : null,
      },
      linkExpiresAt: expiresAt.toISOString(),
    };
  }

  /** The order behind a link, locked; a drafted order (its link never sent) is as unknown as a forged one. */
  async function lockByToken(token: string, m: EntityManager) {
    const check = orderIdOf(token);
    const order = await repos.equipmentOrders.findForUpdate(check.orderId, m);
    if (!order || order.status === 'drafted' || order.status === 'failed') throw new LinkNotValidError('invalid');
    return { order, expiresAt: check.expiresAt };
  }

  async function change(order: EquipmentOrderEntity, m: EntityManager, status: 'confirmed' | 'delivered', note: string | null, details: Record<string, unknown>) {
    order.status = status;
    order.rowVersion += 1;
    order.history = [...order.history, historyEntry(status, clock.now(), null, 'supplier', note)];
    await repos.equipmentOrders.save(order, m);
    await repos.audit.append({ programmeId: order.programmeId, actorId: null, action: status === 'confirmed' ? 'equipment_order.confirmed' : 'equipment_order.delivered', entityType: 'infant', entityId: order.infantId,
      details: { orderId: order.id, reference: order.reference, by: 'supplier', ...details } }, m);
  }

  return {
    async show(token: string) {
      const check = orderIdOf(token);
      const order = await repos.equipmentOrders.findById(check.orderId);
      if (!order || order.status === 'drafted' || order.status === 'failed') throw new LinkNotValidError('invalid');
      return { order: await view(order, check.expiresAt) };
    },

    async confirm(token: string, deliveryOn: string) {
      return ds.transaction(async (m) => {
        const { order, expiresAt } = await lockByToken(token, m);
        if (order.status !== 'sent' && order.status !== 'confirmed') throw new ConflictError(`This order is ${order.status}: nothing to confirm.`);
        const today = todayIn((await repos.programmes.findById(order.programmeId))?.timeZone ?? 'UTC', clock.now());
        if (deliveryOn < today) throw new ValidationError({ deliveryOn: ['The delivery date cannot be in the past'] });
        const before = order.deliveryOn;
        order.deliveryOn = deliveryOn;
        await change(order, m, 'confirmed', `delivery on ${deliveryOn}`, { deliveryOn, before, neededBy: order.neededBy });
        return { order: await view(order, expiresAt, m) };
      });
    },

    async delivered(token: string) {
      return ds.transaction(async (m) => {
        const { order, expiresAt } = await lockByToken(token, m);
        if (order.status !== 'confirmed') throw new ConflictError(order.status === 'sent' ? 'Confirm the delivery date first.' : `This order is ${order.status}.`);
        order.deliveredAt = clock.now();
        await change(order, m, 'delivered', null, { deliveryOn: order.deliveryOn });
        return { order: await view(order, expiresAt, m) };
      });
    },
  };
}
export type SupplierService = ReturnType<typeof createSupplierService>;
