import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { Health } from '@shared/api/health';
import { isDatabaseUp } from '../../db/database';

/** Liveness plus a database probe; 503 while the database is unreachable. */
export function healthRoutes(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const up = await isDatabaseUp(sequelize);
    const body: Health = up ? { status: 'ok', db: 'ok' } : { status: 'degraded', db: 'down' };
    res.status(up ? 200 : 503).json(body);
  });
  return router;
}
