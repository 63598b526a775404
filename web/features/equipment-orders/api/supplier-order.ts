import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { errorBodySchema } from '@shared/schemas/common';
import { supplierOrderViewSchema } from '@shared/schemas/equipment-orders';
import { ApiError } from '../../../lib/api-error';
import { orderKeys } from './order-keys';

// The supplier has no account: these calls go to /supplier-api with the signed link as the only credential, so they
// skip the app's client (which would fetch a session and a CSRF token the supplier does not have).
const answer = z.object({ order: supplierOrderViewSchema });

async function call(path: string, init?: RequestInit) {
  const response = await fetch(path, { ...init, credentials: 'omit', headers: { Accept: 'application/json', ...(init?.body ? { 'Content-Type': 'application/json' } : {}) } });
  const body: unknown = await response.json().catch(() => undefined);
  if (!response.ok) {
    const parsed = errorBodySchema.safeParse(body);
    throw new ApiError(parsed.success ? { status: response.status, ...parsed.data.error }
      : { status: response.status, code: `http_${response.status}`, message: 'The order could not be loaded. Try again in a moment.' });
  }
  return answer.parse(body).order;
}

const base = (token: string) => `/supplier-api/orders/${encodeURIComponent(token)}`;

export const supplierOrderQueryOptions = (token: string) =>
  queryOptions({ queryKey: orderKeys.supplier(token), queryFn: () => call(base(token)), retry: false });
export const useSupplierOrder = (token: string) => useQuery(supplierOrderQueryOptions(token));

export function useSupplierAction(token: string) {
  const queryClient = useQueryClient();
  const done = (order: z.infer<typeof supplierOrderViewSchema>) => queryClient.setQueryData(orderKeys.supplier(token), order);
  return {
    confirm: useMutation({
      mutationFn: (deliveryOn: string) => call(`${base(token)}/confirm`, { method: 'POST', body: JSON.stringify({ deliveryOn }) }),
      meta: { inlineErrors: ['validation_failed', 'conflict'] },
      onSuccess: done,
    }),
    delivered: useMutation({
      mutationFn: () => call(`${base(token)}/delivered`, { method: 'POST', body: '{}' }),
      meta: { inlineErrors: ['conflict'] },
      onSuccess: done,
    }),
  };
}
