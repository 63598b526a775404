import { Router } from 'express';
import { updatePolicySchema } from '@shared/schemas/policy';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCan, currentUser } from '../../lib/http';
import type { PolicyService } from './policy.service';
import { DEFAULT_SUPPLIER_SETTINGS } from '@shared/schemas/supplier';

export function policyRouter(service: PolicyService): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/', async (req, res) => {
    const { programmeId } = currentUser(req);
    assertCan(req, 'read', 'Policy', { programmeId });
    const policy = await service.current(programmeId);
    // A family reads the targets, numbers and cylinders it needs; the staff's checklist set-up (their own items come
    // through the discharge route, in plain words) and the supplier's order address are not for them.
    if (currentUser(req).role !== 'family') return void res.json(policy);
    res.json({ ...policy, settings: { ...policy.settings, discharge: { ...policy.settings.discharge, items: [] }, supplier: DEFAULT_SUPPLIER_SETTINGS } });
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
