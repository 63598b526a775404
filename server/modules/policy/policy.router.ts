import { Router } from 'express';
import type { PoliciesRepository } from '../../db/repositories/policies.repository';
import { requireUser } from '../../middleware/require-user';
import { assertCan, currentUser } from '../../lib/http';

export function policyRouter(policies: PoliciesRepository): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/', async (req, res) => {
    const { programmeId } = currentUser(req);
    assertCan(req, 'read', 'Policy', { programmeId });
    res.json(await policies.current(programmeId));
  });
  return r;
}
