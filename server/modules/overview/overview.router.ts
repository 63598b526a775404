import { Router } from 'express';
import { ForbiddenError } from '../../lib/errors';
import { currentUser } from '../../lib/http';
import { requireUser } from '../../middleware/require-user';
import { systemClock, type Clock } from '../../lib/clock';
import type { OverviewService } from './overview.service';

/** GET /api/overview: the start page of the caller's role, every figure in one answer. */
export function overviewRouter(service: OverviewService, clock: Clock = systemClock): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/', async (req, res) => {
    const user = currentUser(req);
    const caller = { programmeId: user.programmeId, timeZone: user.programmeTimeZone, now: clock.now() };
    // Each view needs the rights its role's work rests on; nurses have My day, families their own page.
    if (user.role === 'coordinator' && req.ability.can('create', 'Infant')) return void res.json(await service.coordinator(req.ability, caller));
    if (user.role === 'admin' && req.ability.can('update', 'Policy')) return void res.json(await service.admin(req.ability, caller));
    if (user.role === 'consultant' && req.ability.can('approve', 'Prescription')) return void res.json(await service.consultant(req.ability, caller));
    throw new ForbiddenError('There is no overview page for your role.');
  });
  return r;
}
