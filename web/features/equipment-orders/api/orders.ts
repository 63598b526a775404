import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { infantOrdersSchema, orderAnswerSchema, ordersPageSchema, type CreateOrderInput, type OrderAnswer } from '@shared/schemas/equipment-orders';
import { api } from '../../../lib/api-client';
import { dischargeKeys } from '../../discharge/api/discharge-keys';
import { orderKeys } from './order-keys';

export const infantOrdersQueryOptions = (infantId: string) =>
  queryOptions({
    queryKey: orderKeys.forInfant(infantId),
    queryFn: ({ signal }) => api.get(`/api/infants/${encodeURIComponent(infantId)}/equipment-orders`, infantOrdersSchema, undefined, signal),
  });
export const useInfantOrders = (infantId: string) => useQuery(infantOrdersQueryOptions(infantId));

export const programmeOrdersQueryOptions = (status: string, after: string) =>
  queryOptions({
    queryKey: [...orderKeys.programme(status), after],
    queryFn: ({ signal }) => api.get('/api/equipment-orders', ordersPageSchema, { ...(status ? { status } : {}), ...(after ? { after } : {}) }, signal),
  });
export const useProgrammeOrders = (status: string, after: string) => useQuery(programmeOrdersQueryOptions(status, after));

const sentWords = (data: OrderAnswer) =>
  data.order.status === 'sent' ? `Order ${data.order.reference} sent to the supplier.`
    : data.order.status === 'failed' ? `Order ${data.order.reference} could not be sent: ${data.order.failureReason ?? ''}`
      : `Order ${data.order.reference} saved as a draft.`;

export function useCreateOrder(infantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateOrderInput) => api.post(`/api/infants/${encodeURIComponent(infantId)}/equipment-orders`, input, orderAnswerSchema),
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found'], successToast: (d: unknown) => sentWords(orderAnswerSchema.parse(d)) },
    // The checklist's equipment items follow the orders.
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: orderKeys.lists() }), queryClient.invalidateQueries({ queryKey: dischargeKeys.detail(infantId) })]),
  });
}

export function useSendOrder(infantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post(`/api/equipment-orders/${encodeURIComponent(id)}/send`, {}, orderAnswerSchema),
    meta: { successToast: (d: unknown) => sentWords(orderAnswerSchema.parse(d)) },
    onSettled: () => Promise.all([queryClient.invalidateQueries({ queryKey: orderKeys.forInfant(infantId) }), queryClient.invalidateQueries({ queryKey: dischargeKeys.detail(infantId) })]),
  });
}

export function useCancelOrder(infantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, reason }: { id: string; reason: string }) => api.post(`/api/equipment-orders/${encodeURIComponent(id)}/cancel`, { reason }, orderAnswerSchema),
    meta: { inlineErrors: ['validation_failed', 'conflict', 'forbidden', 'not_found'], successToast: () => 'Order cancelled.' },
    onSettled: () => Promise.all([queryClient.invalidateQueries({ queryKey: orderKeys.forInfant(infantId) }), queryClient.invalidateQueries({ queryKey: dischargeKeys.detail(infantId) })]),
  });
}
