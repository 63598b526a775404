import { Router } from 'express';
import { changePasswordSchema, setPasswordSchema, setupLinkCheckSchema } from '@shared/schemas/accounts';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, currentUser } from '../../lib/http';
import type { AccountsService } from './accounts.service';

/** Signed-out: the set-up link's page (CSRF from the pre-session cookie, like sign-in). */
export function setupLinkRouter(service: AccountsService): Router {
  const r = Router();
  r.post('/check', validate({ body: setupLinkCheckSchema }), async (req, res) => {
    res.set('Cache-Control', 'no-store');
    res.json(await service.checkLink(req.body.token));
  });
  r.post('/', validate({ body: setPasswordSchema }), async (req, res) => {
    res.set('Cache-Control', 'no-store');
    res.json(await service.setPassword(req.body, req.ip ?? null));
  });
  return r;
}

/** Signed-in: change my own password. */
export function myPasswordRouter(service: AccountsService): Router {
  const r = Router();
  r.use(requireUser);
  r.put('/', validate({ body: changePasswordSchema }), async (req, res) => {
    await service.changePassword({ ...actorOf(req), email: currentUser(req).email }, req.sessionID, req.body);
    res.status(204).end();
  });
  return r;
}
