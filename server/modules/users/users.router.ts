import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { createUserSchema, listUsersQuerySchema, type ListUsersQuery } from '@shared/schemas/users';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCan, assertCanAny } from '../../lib/http';
import type { UsersService } from './users.service';

export function usersRouter(service: UsersService): Router {
  const r = Router();
  r.use(requireUser);

  r.get('/', validate({ query: listUsersQuerySchema }), async (req, res) => {
    assertCanAny(req, 'read', 'User');
    res.json(await service.list(req.ability, req.query as unknown as ListUsersQuery));
  });

  // 202 whether or not the address already had an account: the invitation (or a notice to the owner) is on its way.
  r.post('/', validate({ body: createUserSchema }), async (req, res) => {
    const actor = actorOf(req);
    assertCan(req, 'create', 'User', { programmeId: actor.programmeId });
    res.status(202).json(await service.invite(actor, req.body));
  });

  r.post('/:id/setup-link', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'update', 'User');
    res.status(202).json({ user: await service.sendSetupLink(req.ability, actorOf(req), String(req.params.id)) });
  });

  r.post('/:id/disable', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'disable', 'User');
    res.json({ user: await service.disable(req.ability, actorOf(req), String(req.params.id)) });
  });

  r.post('/:id/enable', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'disable', 'User');
    res.json({ user: await service.enable(req.ability, actorOf(req), String(req.params.id)) });
  });
  return r;
}
