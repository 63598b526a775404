import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { readLogQuerySchema, type ReadLogQuery } from '@shared/schemas/audit';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { assertCan, currentUser } from '../../lib/http';
import type { AuditChainService } from './chain.service';
import type { ReadsService } from './reads.service';

/** /api/audit (the hash chain's checks) and /api/infants/:id/reads (who looked at a baby's record): admins only. */
export function auditRouters(chain: AuditChainService, reads: ReadsService) {
  const audit = Router();
  audit.use(requireUser);
  audit.get('/chain/checks', async (req, res) => {
    const user = currentUser(req);
    assertCan(req, 'read', 'AuditChain', { programmeId: user.programmeId });
    res.json(await chain.checks(user.programmeId));
  });
  audit.post('/chain/verify', async (req, res) => {
    const user = currentUser(req);
    assertCan(req, 'read', 'AuditChain', { programmeId: user.programmeId });
    res.json(await chain.verifyProgramme(user.programmeId, { id: user.id, name: user.name }));
  });

  const infants = Router();
  infants.get('/:id/reads', requireUser, validate({ params: idParamsSchema, query: readLogQuerySchema }), async (req, res) => {
    const user = currentUser(req);
    assertCan(req, 'read', 'AccessLog', { programmeId: user.programmeId });
    res.json(await reads.list(req.ability, user.programmeId, user.programmeTimeZone, String(req.params.id), req.query as unknown as ReadLogQuery));
  });
  return { audit, infants };
}
