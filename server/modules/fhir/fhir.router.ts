import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { FHIR_JSON } from '@shared/fhir/infant-bundle';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { assertCanAny } from '../../lib/http';
import { systemClock, type Clock } from '../../lib/clock';
import type { FhirService } from './fhir.service';
import { auditRead } from '../audit/read-audit';

export function fhirRouter(service: FhirService, clock: Clock = systemClock): Router {
  const r = Router();
  r.get('/:id/fhir', requireUser, validate({ params: idParamsSchema }), async (req, res) => {
    // Staff only: reading overnight recordings is a staff right, so a family account stops here (403).
    assertCanAny(req, 'read', 'Recording');
    const { filename, bundle } = await service.exportInfant(req.ability, String(req.params.id), clock.now());
    const body = JSON.stringify(bundle);
    await auditRead(req, { action: 'infant.fhir_exported', infantId: String(req.params.id) });
    res.set({
      'Content-Type': `${FHIR_JSON}; charset=utf-8`,
      // The name is "nestflow-" and a UUID the route has validated, so it needs no quoting or encoding.
      'Content-Disposition': `attachment; filename="${filename}"`,
      'Cache-Control': 'no-store',
    });
    res.send(body);
  });
  return r;
}
