import { Router } from 'express';
import type { SitesRepository } from '../../db/repositories/sites.repository';
import { requireUser } from '../../middleware/require-user';
import { assertCanAny, currentUser } from '../../lib/http';

export function sitesRouter(sites: SitesRepository): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/', async (req, res) => {
    assertCanAny(req, 'create', 'ConversionPreview');
    const rows = await sites.listForProgramme(currentUser(req).programmeId);
    res.json({ items: rows.map((s) => ({ id: s.id, name: s.name, elevationM: s.elevationM })) });
  });
  return r;
}
