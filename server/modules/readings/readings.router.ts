import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { createReadingSchema, readingsQuerySchema, updateReadingSchema } from '@shared/schemas/readings';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCanAny, currentUser } from '../../lib/http';
import { sendCsv } from '../../lib/csv';
import type { ReadingsService } from './readings.service';
import { readingColumns } from './readings-csv';
import { auditRead } from '../audit/read-audit';

export function readingsRouters(service: ReadingsService) {
  const infants = Router();
  infants.use(requireUser);
  infants.post('/:id/readings', validate({ params: idParamsSchema, body: createReadingSchema }), async (req, res) => {
    assertCanAny(req, 'create', 'Reading');
    const user = currentUser(req);
    res.status(201).json(await service.create(req.ability, { ...actorOf(req), role: user.role, timeZone: user.programmeTimeZone }, String(req.params.id), req.body));
  });
  infants.get('/:id/readings', validate({ params: idParamsSchema, query: readingsQuerySchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Reading');
    const q = req.query as { from?: string; to?: string };
    const list = await service.list(req.ability, String(req.params.id), q.from, q.to);
    await auditRead(req, { action: 'infant.readings_viewed', infantId: String(req.params.id) });
    res.json(list);
  });

  // All the baby's readings (or those between from and to) as a CSV download, with the list's rights.
  infants.get('/:id/readings.csv', validate({ params: idParamsSchema, query: readingsQuerySchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Reading');
    const q = req.query as { from?: string; to?: string };
    const rows = await service.exportRows(req.ability, String(req.params.id), q);
    const timeZone = currentUser(req).programmeTimeZone;
    await auditRead(req, { action: 'infant.readings_exported', infantId: String(req.params.id) });
    await sendCsv(res, `readings-${String(req.params.id)}.csv`, readingColumns(timeZone), rows);
  });

  const readings = Router();
  readings.use(requireUser);
  readings.patch('/:id', validate({ params: idParamsSchema, body: updateReadingSchema }), async (req, res) => {
    assertCanAny(req, 'create', 'Reading');
    res.json(await service.update(req.ability, actorOf(req), String(req.params.id), req.body));
  });
  return { infants, readings };
}
