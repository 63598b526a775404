import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { assertCanAny, currentUser } from '../../lib/http';
import { todayIn } from '../../lib/dates';
import { systemClock, type Clock } from '../../lib/clock';
import type { ScheduleService } from './schedule.service';

export function scheduleRouters(service: ScheduleService, clock: Clock = systemClock) {
  const infants = Router();
  infants.use(requireUser);
  infants.get('/:id/schedule', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Reading');
    res.json(await service.forInfant(req.ability, String(req.params.id)));
  });

  const day = Router();
  day.use(requireUser);
  day.get('/', async (req, res) => {
    assertCanAny(req, 'read', 'Reading');
    const { programmeTimeZone, id } = currentUser(req);
    res.json(await service.day(req.ability, todayIn(programmeTimeZone, clock.now()), id, programmeTimeZone));
  });
  return { infants, day };
}
