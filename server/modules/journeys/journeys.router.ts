import { Router, type Request } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { createJourneySchema, journeyDecisionSchema } from '@shared/schemas/journeys';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { ForbiddenError } from '../../lib/errors';
import { actorOf, assertCanAny, currentUser } from '../../lib/http';
import type { JourneysService } from './journeys.service';
import type { Audience } from './journeys.mapper';
import { auditRead } from '../audit/read-audit';

const audienceOf = (req: Request): Audience => (currentUser(req).role === 'family' ? 'family' : 'staff');

export function journeysRouters(service: JourneysService) {
  const infants = Router();
  infants.use(requireUser);
  infants.post('/:id/journeys', validate({ params: idParamsSchema, body: createJourneySchema }), async (req, res) => {
    assertCanAny(req, 'create', 'Journey');
    const actor = { ...actorOf(req), timeZone: currentUser(req).programmeTimeZone };
    res.status(201).json({ journey: await service.create(req.ability, actor, String(req.params.id), req.body, audienceOf(req)) });
  });
  infants.get('/:id/journeys', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Journey');
    const list = await service.listForInfant(req.ability, String(req.params.id), audienceOf(req));
    await auditRead(req, { action: 'infant.journeys_viewed', infantId: String(req.params.id) });
    res.json(list);
  });

  const journeys = Router();
  journeys.use(requireUser);
  // The sign-off list: consultants decide; coordinators, who arrange the trips, may follow it.
  journeys.get('/waiting', async (req, res) => {
    if (!req.ability.can('approve', 'Journey') && !req.ability.can('update', 'Journey')) throw new ForbiddenError();
    res.json(await service.waiting(req.ability));
  });
  journeys.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Journey');
    const journey = await service.get(req.ability, String(req.params.id), audienceOf(req));
    await auditRead(req, { action: 'journey.viewed', infantId: journey.infantId, details: { journeyId: journey.id } });
    res.json({ journey });
  });
  journeys.post('/:id/decision', validate({ params: idParamsSchema, body: journeyDecisionSchema }), async (req, res) => {
    assertCanAny(req, 'approve', 'Journey');
    res.json({ journey: await service.decide(req.ability, actorOf(req), String(req.params.id), req.body) });
  });
  return { infants, journeys };
}
