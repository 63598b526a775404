import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { decisionSchema } from '@shared/schemas/prescriptions';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCanAny, currentUser } from '../../lib/http';
import type { PrescriptionsService } from './prescriptions.service';
import { auditRead } from '../audit/read-audit';

export function prescriptionsRouter(service: PrescriptionsService): Router {
  const r = Router();
  r.use(requireUser);

  r.get('/queue', async (req, res) => {
    assertCanAny(req, 'approve', 'Prescription');
    res.json(await service.queue(req.ability, currentUser(req).programmeTimeZone));
  });

  r.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Prescription');
    const version = await service.get(req.ability, String(req.params.id), currentUser(req).role);
    await auditRead(req, { action: 'prescription.viewed', infantId: version.infantId, details: { prescriptionId: version.id, version: version.version } });
    res.json(version);
  });

  r.post('/:id/decision', validate({ params: idParamsSchema, body: decisionSchema }), async (req, res) => {
    assertCanAny(req, 'approve', 'Prescription');
    res.json(await service.decide(req.ability, actorOf(req), String(req.params.id), req.body));
  });
  return r;
}
