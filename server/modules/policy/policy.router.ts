import { Router } from 'express';
import { updatePolicySchema } from '@shared/schemas/policy';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCan, currentUser } from '../../lib/http';
import type { PolicyService } from './policy.service';

export function policyRouter(service: PolicyService): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/', async (req, res) => {
    const { programmeId } = currentUser(req);
    assertCan(req, 'read', 'Policy', { programmeId });
    res.json(await service.current(programmeId));
  });
  r.get('/history', async (req, res) => {
    const { programmeId } = currentUser(req);
    assertCan(req, 'read', 'Policy', { programmeId });
    res.json(await service.history(programmeId));
  });
  r.put('/', validate({ body: updatePolicySchema }), async (req, res) => {
    const actor = actorOf(req);
    assertCan(req, 'update', 'Policy', { programmeId: actor.programmeId });
    res.json(await service.update(actor, req.body));
  });
  return r;
}
