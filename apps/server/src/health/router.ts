import { Router } from 'express';
import type { HealthService } from './service.js';

export function healthRouter(service: HealthService): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    res.set('Cache-Control', 'no-store').json(await service.check());
  });
  return router;
}
