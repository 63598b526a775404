import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { bookVisitSchema, cancelVisitSchema, completeVisitSchema, moveVisitSchema } from '@shared/schemas/visits';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCanAny, currentUser } from '../../lib/http';
import type { VisitsService } from './visits.service';

export function visitsRouters(service: VisitsService) {
  const infants = Router();
  infants.use(requireUser);
  infants.post('/:id/visits', validate({ params: idParamsSchema, body: bookVisitSchema }), async (req, res) => {
    assertCanAny(req, 'create', 'Visit');
    res.status(201).json(await service.book(req.ability, { ...actorOf(req), timeZone: currentUser(req).programmeTimeZone }, String(req.params.id), req.body));
  });
  infants.get('/:id/visits', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Visit');
    res.json(await service.list(req.ability, String(req.params.id)));
  });

  const visits = Router();
  visits.use(requireUser);
  visits.patch('/:id', validate({ params: idParamsSchema, body: moveVisitSchema }), async (req, res) => {
    assertCanAny(req, 'update', 'Visit');
    res.json(await service.move(req.ability, actorOf(req), String(req.params.id), req.body));
  });
  visits.post('/:id/cancel', validate({ params: idParamsSchema, body: cancelVisitSchema }), async (req, res) => {
    assertCanAny(req, 'update', 'Visit');
    res.json(await service.cancel(req.ability, actorOf(req), String(req.params.id), req.body.reason));
  });
  visits.post('/:id/done', validate({ params: idParamsSchema, body: completeVisitSchema }), async (req, res) => {
    assertCanAny(req, 'update', 'Visit');
    res.json(await service.complete(req.ability, actorOf(req), String(req.params.id), req.body.rowVersion));
  });
  return { infants, visits };
}
