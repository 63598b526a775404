import { Router } from 'express';
import { updatePreferencesSchemaFor } from '@shared/schemas/preferences';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCanAny, currentUser } from '../../lib/http';
import type { PreferencesService } from './preferences.service';

export function preferencesRouter(service: PreferencesService) {
  const router = Router();
  router.use(requireUser);
  router.get('/', async (req, res) => {
    assertCanAny(req, 'read', 'Preferences');
    res.json({ preferences: await service.get(actorOf(req).id) });
  });
  router.put('/', validate((req) => ({ body: updatePreferencesSchemaFor(currentUser(req).programmeCountry) })), async (req, res) => {
    assertCanAny(req, 'update', 'Preferences');
    res.json({ preferences: await service.update(actorOf(req), req.body) });
  });
  return router;
}
