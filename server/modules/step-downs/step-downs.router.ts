import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { stepDownRequestSchema } from '@shared/schemas/step-downs';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCanAny } from '../../lib/http';
import { toPrescriptionDto } from '../prescriptions/prescriptions.mapper';
import type { StepDownsService } from './step-downs.service';
import { systemClock, type Clock } from '../../lib/clock';

export function stepDownsRouter(service: StepDownsService, clock: Clock = systemClock): Router {
  const r = Router();
  r.use(requireUser);
  r.post('/:id/step-down-requests', validate({ params: idParamsSchema, body: stepDownRequestSchema }), async (req, res) => {
    assertCanAny(req, 'create', 'StepDown');
    const rx = await service.request(req.ability, actorOf(req), String(req.params.id), req.body, clock.now());
    res.status(201).json(toPrescriptionDto(rx, new Map()));
  });
  r.get('/:id/step-down-checks', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'create', 'StepDown');
    res.json(await service.preview(req.ability, String(req.params.id), clock.now()));
  });
  return r;
}
