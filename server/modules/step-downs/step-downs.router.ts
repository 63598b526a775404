import { Router } from 'express';
import { idParamsSchema } from '../../../shared/schemas/common';
import { stepDownRequestSchema } from '../../../shared/schemas/step-downs';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCanAny } from '../../lib/http';
import { toPrescriptionDto } from '../prescriptions/prescriptions.mapper';
import type { StepDownsService } from './step-downs.service';

export function stepDownsRouter(service: StepDownsService): Router {
  const r = Router();
  r.use(requireUser);
  r.post('/:id/step-down-requests', validate({ params: idParamsSchema, body: stepDownRequestSchema }), async (req, res) => {
    assertCanAny(req, 'create', 'StepDown');
    const rx = await service.request(req.ability, actorOf(req), String(req.params.id), req.body.reason);
    res.status(201).json(toPrescriptionDto(rx, new Map()));
  });
  return r;
}
