import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas/common';
import { listMessagesQuerySchema, type ListMessagesQuery } from '@shared/schemas/messages';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCanAny, currentUser } from '../../lib/http';
import type { MessagesService } from './messages.service';

export function messagesRouter(service: MessagesService) {
  const router = Router();
  router.use(requireUser);
  router.get('/', validate({ query: listMessagesQuerySchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Message');
    res.json(await service.list(req.ability, currentUser(req).programmeId, req.query as unknown as ListMessagesQuery, currentUser(req).programmeCountry));
  });
  router.post('/:id/retry', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'update', 'Message');
    res.json({ message: await service.retry(req.ability, actorOf(req), String(req.params.id)) });
  });
  router.post('/:id/arrived', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'update', 'Message');
    res.json({ message: await service.confirmArrived(req.ability, actorOf(req), String(req.params.id)) });
  });
  return router;
}
