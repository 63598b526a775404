import { idParamsSchema } from '@shared/schemas/common';
import { cancelOrderSchema, createOrderSchema, infantOrdersSchema, orderAnswerSchema, ordersPageSchema, ordersQuerySchema } from '@shared/schemas/equipment-orders';
import { json, route } from '../../openapi/api-route';

// The supplier's side (/supplier-api/orders/:token…) is outside /api and this description: no session, the signed link
// is the credential.
export const equipmentOrdersApi = [
  route('post', '/infants/:id/equipment-orders', { summary: 'Order equipment from the supplier (sent at once unless send is false; a mail failure leaves it failed, still 201)', who: 'coordinator', params: idParamsSchema, body: createOrderSchema, responses: { 201: json('The order', orderAnswerSchema) } }),
  route('get', '/infants/:id/equipment-orders', { summary: 'The baby’s equipment orders, newest first', who: 'staff who may read the baby', params: idParamsSchema, responses: { 200: json('Orders', infantOrdersSchema) } }),
  route('get', '/equipment-orders', { summary: 'The programme’s orders, newest first, filtered by status (open, overdue…), a page at a time', who: 'coordinator, admin', query: ordersQuerySchema, responses: { 200: json('One page of orders', ordersPageSchema) } }),
  route('post', '/equipment-orders/:id/send', { summary: 'Send a drafted or failed order (a mail failure leaves it failed, still 200); 409 once sent', who: 'coordinator', params: idParamsSchema, errors: [409], responses: { 200: json('The order', orderAnswerSchema) } }),
  route('post', '/equipment-orders/:id/cancel', { summary: 'Cancel an order (the supplier is told if it had it); 409 once delivered or cancelled', who: 'coordinator', params: idParamsSchema, body: cancelOrderSchema, errors: [409], responses: { 200: json('The order', orderAnswerSchema) } }),
];
