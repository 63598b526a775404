import express, { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { cancelOrderSchema, createOrderSchema, ordersQuerySchema, supplierConfirmSchema, supplierDeliveredSchema } from '@shared/schemas/equipment-orders';
import { z } from 'zod';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCanAny, currentUser } from '../../lib/http';
import { ForbiddenError, NotFoundError } from '../../lib/errors';
import type { EquipmentOrdersService } from './equipment-orders.service';
import type { SupplierService } from './supplier.service';

export function equipmentOrdersRouters(service: EquipmentOrdersService) {
  const infants = Router();
  infants.use(requireUser);
  infants.post('/:id/equipment-orders', validate({ params: idParamsSchema, body: createOrderSchema }), async (req, res) => {
    assertCanAny(req, 'create', 'EquipmentOrder');
    res.status(201).json({ order: await service.create(req.ability, actorOf(req), String(req.params.id), req.body) });
  });
  infants.get('/:id/equipment-orders', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'EquipmentOrder');
    res.json(await service.listForInfant(req.ability, String(req.params.id)));
  });

  const orders = Router();
  orders.use(requireUser);
  orders.get('/', validate({ query: ordersQuerySchema }), async (req, res) => {
    // The programme's list is the coordinator's (and admin's) work queue; a nurse sees orders on the baby's record.
    assertCanAny(req, 'read', 'EquipmentOrder');
    if (!['coordinator', 'admin'].includes(currentUser(req).role)) throw new ForbiddenError('The orders list is for coordinators and admins.');
    res.json(await service.list(req.ability, currentUser(req).programmeId, req.query as unknown as z.infer<typeof ordersQuerySchema>));
  });
  orders.post('/:id/send', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'update', 'EquipmentOrder');
    res.json({ order: await service.send(req.ability, actorOf(req), String(req.params.id)) });
  });
  orders.post('/:id/cancel', validate({ params: idParamsSchema, body: cancelOrderSchema }), async (req, res) => {
    assertCanAny(req, 'update', 'EquipmentOrder');
    res.json({ order: await service.cancel(req.ability, actorOf(req), String(req.params.id), req.body.reason) });
  });
  return { infants, orders };
}

const tokenParams = z.strictObject({ token: z.string().max(200) });

/**
 * The supplier's side, outside /api: no session, no cookie, no CSRF token. The signed link in the path is the only
 * credential; a cross-site page cannot forge a request without knowing it, and no ambient cookie is sent or read.
 */
export function supplierRouter(service: SupplierService): Router {
  const r = Router();
  r.use((_req, res, next) => {
    // The link must not travel in a Referer header or sit in a shared cache.
    res.set({ 'Cache-Control': 'no-store', 'Referrer-Policy': 'no-referrer', 'X-Robots-Tag': 'noindex' });
    next();
  });
  r.use(express.json({ limit: '10kb' }));
  r.get('/orders/:token', validate({ params: tokenParams }), async (req, res) => {
    res.json(await service.show(String(req.params.token)));
  });
  r.post('/orders/:token/confirm', validate({ params: tokenParams, body: supplierConfirmSchema }), async (req, res) => {
    res.json(await service.confirm(String(req.params.token), req.body.deliveryOn));
  });
  r.post('/orders/:token/delivered', validate({ params: tokenParams, body: supplierDeliveredSchema }), async (req, res) => {
    res.json(await service.delivered(String(req.params.token)));
  });
  r.use(() => {
    throw new NotFoundError();
  });
  return r;
}
