import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { assertCanAny } from '../../lib/http';
import type { CarePlanService } from './care-plan.service';
import { auditRead } from '../audit/read-audit';

export function carePlanRouter(service: CarePlanService): Router {
  const r = Router();
  r.get('/:id/care-plan.pdf', requireUser, validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Prescription');
    const { filename, pdf } = await service.build(req.ability, String(req.params.id));
    await auditRead(req, { action: 'infant.care_plan_printed', infantId: String(req.params.id) });
    res.set({
      'Content-Type': 'application/pdf',
      // The name is built from [a-z0-9-] and a date only, so it needs no quoting or encoding.
      'Content-Disposition': `attachment; filename="${filename}"`,
      'Cache-Control': 'no-store',
      'Content-Length': String(pdf.length),
    });
    res.end(pdf);
  });
  return r;
}
