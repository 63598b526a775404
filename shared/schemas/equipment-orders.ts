import { z } from 'zod';
import { plainText } from './common';

/** What can be on an order to the oxygen supplier. */
export const EQUIPMENT_KINDS = ['concentrator', 'static_cylinder', 'portable_cylinder', 'spares', 'oximeter'] as const;
export type EquipmentKind = (typeof EQUIPMENT_KINDS)[number];
export const EQUIPMENT_KIND_LABELS: Record<EquipmentKind, string> = {
  concentrator: 'Oxygen concentrator',
  static_cylinder: 'Static cylinders',
  portable_cylinder: 'Portable cylinders',
  spares: 'Spares (tubing, cannulas …)',
  oximeter: 'Pulse oximeter (on loan)',
};

/** delivery: first equipment; change: different equipment for a new setting; collection: take it all back. */
export const ORDER_PURPOSES = ['delivery', 'change', 'collection'] as const;
export type OrderPurpose = (typeof ORDER_PURPOSES)[number];
export const ORDER_PURPOSE_LABELS: Record<OrderPurpose, string> = { delivery: 'Delivery', change: 'Change of equipment', collection: 'Collection' };

export const ORDER_STATUSES = ['drafted', 'sent', 'failed', 'confirmed', 'delivered', 'cancelled'] as const;
export type OrderStatus = (typeof ORDER_STATUSES)[number];
export const ORDER_STATUS_LABELS: Record<OrderStatus, string> = {
  drafted: 'Drafted (not sent)', sent: 'Sent, waiting for the supplier', failed: 'Sending failed', confirmed: 'Delivery date confirmed',
  delivered: 'Delivered', cancelled: 'Cancelled',
};
/** Statuses in which the supplier has not yet committed to a date. */
export const UNCONFIRMED_STATUSES: readonly OrderStatus[] = ['drafted', 'sent', 'failed'];

const date = z.iso.date({ error: 'Use a date like 2026-12-03' });
const flow = (what: string) => z.number({ error: `Enter the ${what} flow in L/min` }).min(0, { error: 'At least 0 L/min' }).max(15, { error: 'At most 15 L/min' });

export const orderItemSchema = z.strictObject({
  kind: z.enum(EQUIPMENT_KINDS, { error: 'Choose what to order' }),
  quantity: z.number({ error: 'Enter how many' }).int({ error: 'Use a whole number' }).min(1, { error: 'At least 1' }).max(50, { error: 'At most 50' }),
  note: plainText().trim().max(200, { error: 'At most 200 characters' }).optional(),
  /** Cylinders: the size, one of the programme's cylinder ids (settings → equipment supply). */
  size: plainText().trim().max(40).optional(),
  /** Concentrators: the flow range the unit must cover, in L/min. */
  flowMinLpm: flow('lowest').optional(),
  flowMaxLpm: flow('highest').optional(),
}).superRefine((item, ctx) => {
  const cylinder = item.kind === 'static_cylinder' || item.kind === 'portable_cylinder';
  if (cylinder && !item.size) ctx.addIssue({ code: 'custom', path: ['size'], message: 'Choose the cylinder size' });
  if (!cylinder && item.size) ctx.addIssue({ code: 'custom', path: ['size'], message: 'Only cylinders have a size' });
  if (item.kind === 'concentrator') {
    if (item.flowMinLpm === undefined) ctx.addIssue({ code: 'custom', path: ['flowMinLpm'], message: 'Enter the lowest flow the concentrator must give' });
    if (item.flowMaxLpm === undefined) ctx.addIssue({ code: 'custom', path: ['flowMaxLpm'], message: 'Enter the highest flow the concentrator must give' });
    if (item.flowMinLpm !== undefined && item.flowMaxLpm !== undefined && item.flowMinLpm > item.flowMaxLpm) {
      ctx.addIssue({ code: 'custom', path: ['flowMaxLpm'], message: 'Must be at least the lowest flow' });
    }
  } else if (item.flowMinLpm !== undefined || item.flowMaxLpm !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['flowMinLpm'], message: 'Only a concentrator has a flow range' });
  }
});
export type OrderItem = z.infer<typeof orderItemSchema>;

export const createOrderSchema = z.strictObject({
  items: z.array(orderItemSchema, { error: 'Add what to order' }).min(1, { error: 'Add at least one item' }).max(20, { error: 'At most 20 items' }),
  neededBy: date,
  /** Left out: the family's address on record. */
  deliveryAddress: plainText({ multiline: true }).trim().min(5, { error: 'Enter the full delivery address' }).max(300, { error: 'At most 300 characters' }).optional(),
  purpose: z.enum(ORDER_PURPOSES).default('delivery'),
  /** Instructions for the supplier (access, a time that suits the family). */
  note: plainText({ multiline: true }).trim().max(500, { error: 'At most 500 characters' }).optional(),
  /** false keeps the order as a draft for later sending. */
  send: z.boolean().default(true),
});
export type CreateOrderInput = z.input<typeof createOrderSchema>;
export type CreateOrderParsed = z.output<typeof createOrderSchema>;

export const cancelOrderSchema = z.strictObject({
  reason: plainText().trim().min(2, { error: 'Say why the order is cancelled' }).max(300, { error: 'At most 300 characters' }),
});

export const ordersQuerySchema = z.strictObject({
  status: z.enum([...ORDER_STATUSES, 'open', 'overdue']).optional(),
  /** The last row of the previous page (keyset paging, newest first). */
  after: plainText().max(200).optional(),
  pageSize: z.coerce.number().int().min(1).max(100, { error: 'At most 100 rows a page' }).default(50),
});
export type OrdersQuery = z.infer<typeof ordersQuerySchema>;

export const ORDER_FLAGS = ['send_failed', 'unconfirmed_by_needed_date', 'delivery_after_needed_date'] as const;
export type OrderFlag = (typeof ORDER_FLAGS)[number];
export const ORDER_FLAG_LABELS: Record<OrderFlag, string> = {
  send_failed: 'The e-mail to the supplier failed',
  unconfirmed_by_needed_date: 'Not confirmed by the date needed',
  delivery_after_needed_date: 'The supplier’s delivery date is after the date needed',
};

export const orderHistoryEntrySchema = z.object({
  status: z.enum(ORDER_STATUSES),
  at: z.string(),
  /** A staff member's name, or "Supplier" for a change made through the signed link, or "Nestflow" for an automatic draft. */
  by: z.string(),
  note: z.string().nullable(),
});
export type OrderHistoryEntry = z.infer<typeof orderHistoryEntrySchema>;

export const storedItemSchema = z.object({
  kind: z.enum(EQUIPMENT_KINDS), quantity: z.number(), note: z.string().optional(), size: z.string().optional(),
  flowMinLpm: z.number().optional(), flowMaxLpm: z.number().optional(),
});

export const equipmentOrderSchema = z.object({
  id: z.uuid(),
  infantId: z.uuid(),
  infantName: z.string(),
  reference: z.string(),
  purpose: z.enum(ORDER_PURPOSES),
  status: z.enum(ORDER_STATUSES),
  items: z.array(storedItemSchema),
  neededBy: z.string(),
  deliveryAddress: z.string(),
  note: z.string().nullable(),
  supplierEmail: z.string().nullable(),
  deliveryOn: z.string().nullable(),
  deliveredAt: z.string().nullable(),
  failureReason: z.string().nullable(),
  /** Why Nestflow drafted it on its own, or null for an order a person made. */
  automaticReason: z.string().nullable(),
  flags: z.array(z.enum(ORDER_FLAGS)),
  history: z.array(orderHistoryEntrySchema),
  createdAt: z.string(),
});
export type EquipmentOrder = z.infer<typeof equipmentOrderSchema>;

export const ordersPageSchema = z.object({ items: z.array(equipmentOrderSchema), next: z.string().nullable() });
/** A baby's orders, newest first. */
export const infantOrdersSchema = z.object({ items: z.array(equipmentOrderSchema) });
/** The answer to creating, sending or cancelling an order: the order as it now is. */
export const orderAnswerSchema = z.object({ order: equipmentOrderSchema });
export type OrderAnswer = z.infer<typeof orderAnswerSchema>;

// --- The supplier's page (no account: the signed link is the credential).

export const supplierConfirmSchema = z.strictObject({ deliveryOn: date });
export const supplierDeliveredSchema = z.strictObject({});

/** Only what a delivery needs: no diagnosis, no readings, no first name. */
export const supplierOrderViewSchema = z.object({
  reference: z.string(),
  purpose: z.enum(ORDER_PURPOSES),
  status: z.enum(ORDER_STATUSES),
  items: z.array(z.object({ kind: z.enum(EQUIPMENT_KINDS), label: z.string(), quantity: z.number(), detail: z.string().nullable(), note: z.string().nullable() })),
  neededBy: z.string(),
  deliveryAddress: z.string(),
  /** "The Ashdown family": the name on the door. */
  recipient: z.string(),
  note: z.string().nullable(),
  deliveryOn: z.string().nullable(),
  deliveredAt: z.string().nullable(),
  programme: z.object({ name: z.string(), phone: z.string().nullable(), phoneDial: z.string().nullable() }),
  linkExpiresAt: z.string(),
});
export type SupplierOrderView = z.infer<typeof supplierOrderViewSchema>;

/** One line of an order in words, as the supplier, the PDF and the coordinator read it. */
export function itemDetail(item: { kind: EquipmentKind; size?: string; flowMinLpm?: number; flowMaxLpm?: number }, cylinderNames: Readonly<Record<string, string>> = {}): string | null {
  if (item.kind === 'concentrator' && item.flowMinLpm !== undefined && item.flowMaxLpm !== undefined) {
    return `flow range ${item.flowMinLpm}–${item.flowMaxLpm} L/min`;
  }
  if (item.size) return cylinderNames[item.size] ?? item.size;
  return null;
}
