import { Router } from 'express';
import { convertPrescription } from '@shared/clinical/conversion';
import { conversionPreviewBodySchema, type ConversionPreviewBody } from '@shared/schemas/conversions';
import type { PoliciesRepository } from '../../db/repositories/policies.repository';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { assertCanAny, currentUser } from '../../lib/http';

/** The same pure conversion the browser preview and the worker use; nothing is stored. */
export function conversionsRouter(policies: PoliciesRepository): Router {
  const r = Router();
  r.use(requireUser);
  r.post('/preview', validate({ body: conversionPreviewBodySchema }), async (req, res) => {
    assertCanAny(req, 'create', 'ConversionPreview');
    const body = req.body as ConversionPreviewBody;
    const policy = await policies.current(currentUser(req).programmeId);
    res.json(
      convertPrescription({
        ...body,
        flowmeterStepsLpm: body.flowmeterStepsLpm ?? policy.settings.flowmeterStepsLpm,
        cannulaMaxFlowLpm: policy.settings.cannulaMaxFlowLpm,
        pressureModel: policy.settings.pressureModel,
      }),
    );
  });
  return r;
}
