import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { enrolInfantSchemaFor, replaceContactsSchemaFor } from '@shared/schemas/infant-contacts';
import { listInfantsQuerySchema, updateInfantSchema, type ListInfantsQuery } from '@shared/schemas/infants';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCan, assertCanAny, currentUser } from '../../lib/http';
import { todayIn } from '../../lib/dates';
import type { InfantsService } from './infants.service';
import type { PrescriptionsService } from '../prescriptions/prescriptions.service';
import { auditRead } from '../audit/read-audit';

export function infantsRouter(service: InfantsService, prescriptions: PrescriptionsService): Router {
  const r = Router();
  r.use(requireUser);
  const today = (req: Express.Request) => todayIn(currentUser(req as never).programmeTimeZone);

  r.get('/', validate({ query: listInfantsQuerySchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Infant');
    res.json(await service.list(req.ability, currentUser(req), req.query as unknown as ListInfantsQuery, today(req)));
  });

  r.post('/', validate((req) => ({ body: enrolInfantSchemaFor(currentUser(req).programmeCountry) })), async (req, res) => {
    const actor = actorOf(req);
    assertCan(req, 'create', 'Infant', { programmeId: actor.programmeId });
    const out = await service.enrol(req.ability, actor, req.body, today(req));
    res.status(out.created ? 201 : 200).json(out.infant);
  });

  r.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Infant');
    const infant = await service.detail(req.ability, String(req.params.id), today(req));
    await auditRead(req, { action: 'infant.viewed', infantId: String(req.params.id) });
    res.json(infant);
  });

  r.patch('/:id', validate({ params: idParamsSchema, body: updateInfantSchema }), async (req, res) => {
    assertCanAny(req, 'update', 'Infant');
    res.json(await service.update(req.ability, actorOf(req), String(req.params.id), req.body, today(req)));
  });

  r.put('/:id/contacts', validate((req) => ({ params: idParamsSchema, body: replaceContactsSchemaFor(currentUser(req).programmeCountry) })), async (req, res) => {
    assertCanAny(req, 'update', 'Infant');
    res.json(await service.replaceContacts(req.ability, actorOf(req), String(req.params.id), req.body.contacts, today(req)));
  });

  r.get('/:id/prescriptions', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Infant');
    const versions = await prescriptions.listForInfant(req.ability, String(req.params.id), currentUser(req).role);
    await auditRead(req, { action: 'infant.plans_viewed', infantId: String(req.params.id) });
    res.json(versions);
  });

  r.get('/:id/audit', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'AuditEvent');
    res.json(await service.audit(req.ability, String(req.params.id)));
  });
  return r;
}
