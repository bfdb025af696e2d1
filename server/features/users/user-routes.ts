import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { createUserRequestSchema, updateUserRequestSchema } from '@shared/api/users';
import { parseBody, parseId } from '../../http/validate';
import { currentUser, requireRole } from '../../http/require-user';
import { presentUser } from './user-presenter';
import { createUser, listUsers, updateUser } from './user-service';

/** People administration: admins only. */
export function userRoutes(sequelize: Sequelize): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (_req, res) => {
    res.json({ users: (await listUsers()).map(presentUser) });
  });

  router.post('/', async (req, res) => {
    const input = parseBody(createUserRequestSchema, req.body);
    const user = await createUser(sequelize, currentUser(req).id, input);
    res.status(201).json(presentUser(user));
  });

  router.patch('/:userId', async (req, res) => {
    const userId = parseId(req.params.userId, 'That person');
    const input = parseBody(updateUserRequestSchema, req.body);
    res.json(presentUser(await updateUser(sequelize, currentUser(req).id, userId, input)));
  });

  return router;
}
