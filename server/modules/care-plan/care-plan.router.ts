import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { assertCanAny } from '../../lib/http';
import type { CarePlanService } from './care-plan.service';
import { auditRead } from '../audit/read-audit';
import { sendPdf } from '../../lib/send-pdf';

export function carePlanRouter(service: CarePlanService): Router {
  const r = Router();
  r.get('/:id/care-plan.pdf', requireUser, validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Prescription');
    const { filename, pdf } = await service.build(req.ability, String(req.params.id));
    await auditRead(req, { action: 'infant.care_plan_printed', infantId: String(req.params.id) });
    sendPdf(res, filename, pdf);
  });
  return r;
}
