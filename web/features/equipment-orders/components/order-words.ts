import { EQUIPMENT_KIND_LABELS, ORDER_STATUS_LABELS, itemDetail, type EquipmentOrder, type OrderStatus } from '@shared/schemas/equipment-orders';

type Tone = 'ok' | 'muted' | 'warn' | 'danger' | 'brand';
export const STATUS_TONES: Record<OrderStatus, Tone> = { drafted: 'muted', sent: 'brand', failed: 'danger', confirmed: 'brand', delivered: 'ok', cancelled: 'muted' };
export const statusLabel = (status: OrderStatus) => ORDER_STATUS_LABELS[status];

export const itemLine = (item: EquipmentOrder['items'][number], cylinderNames: Record<string, string>) => {
  const detail = itemDetail(item, cylinderNames);
  return `${item.quantity} × ${EQUIPMENT_KIND_LABELS[item.kind]}${detail ? `, ${detail}` : ''}${item.note ? ` (${item.note})` : ''}`;
};
