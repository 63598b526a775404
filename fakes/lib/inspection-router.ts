import express, { type Router } from 'express';
import { failRequestSchema, type FailureSwitch } from './failure-switch';

interface InspectionOptions<T> {
  name: string;
  list(): readonly T[];
  clear(): void;
  failures: FailureSwitch;
}

// The same inspection surface on every fake, so tests and fault drills count deliveries the same way.
export function createInspectionRouter<T>({ name, list, clear, failures }: InspectionOptions<T>): Router {
  const router = express.Router();
  router.get('/health', (_req, res) => {
    res.json({ status: 'ok', fake: name, failures: failures.state() });
  });
  router.get('/messages', (_req, res) => {
    res.json(list());
  });
  router.delete('/messages', (_req, res) => {
    clear();
    res.status(204).end();
  });
  router.post('/fail', express.json(), (req, res) => {
    const parsed = failRequestSchema.safeParse(req.body ?? {});
    if (!parsed.success) {
      res.status(400).json({ error: { code: 'validation', message: 'Expected { mode, count? }', details: parsed.error.issues } });
      return;
    }
    failures.set(parsed.data);
    res.json(failures.state());
  });
  return router;
}
