import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { dischargeItemParamsSchema, emailLetterSchema, setDischargeSchema, updateDischargeItemSchema } from '@shared/schemas/discharge';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCanAny, currentUser } from '../../lib/http';
import type { DischargeService } from './discharge.service';
import type { DischargeLetterService } from './discharge-letter.service';
import { auditRead } from '../audit/read-audit';
import { sendPdf } from '../../lib/send-pdf';

/** The discharge checklist, the discharge date and the letter, under /api/infants/:id. */
export function dischargeRouter(service: DischargeService, letters: DischargeLetterService): Router {
  const r = Router();

  r.get('/:id/discharge', requireUser, validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Discharge');
    res.json(await service.get(req.ability, String(req.params.id), currentUser(req).role === 'family' ? 'family' : 'staff'));
  });
  r.put('/:id/discharge/items/:key', requireUser, validate({ params: dischargeItemParamsSchema, body: updateDischargeItemSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Discharge');
    res.json(await service.updateItem(req.ability, actorOf(req), String(req.params.id), String(req.params.key), req.body));
  });
  r.post('/:id/discharge', requireUser, validate({ params: idParamsSchema, body: setDischargeSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Discharge');
    res.json(await service.setDate(req.ability, { ...actorOf(req), timeZone: currentUser(req).programmeTimeZone }, String(req.params.id), req.body));
  });
  r.get('/:id/discharge-letter.pdf', requireUser, validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Discharge');
    const { filename, pdf } = await letters.build(req.ability, String(req.params.id), currentUser(req).programmeTimeZone);
    await auditRead(req, { action: 'infant.discharge_letter_printed', infantId: String(req.params.id) });
    sendPdf(res, filename, pdf);
  });
  r.post('/:id/discharge-letter/email', requireUser, validate({ params: idParamsSchema, body: emailLetterSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Discharge');
    res.json(await letters.email(req.ability, { ...actorOf(req), timeZone: currentUser(req).programmeTimeZone }, String(req.params.id), req.body.to));
  });
  return r;
}
