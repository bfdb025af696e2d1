import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { createUserRequestSchema, updateUserRequestSchema } from '@shared/api/users';
import { parseBody, parseId } from '../../http/validate';
import { currentUser, requireRole } from '../../http/require-user';
import { presentUser } from './user-presenter';
import { createUser, listUsers, updateUser } from './user-service';
import type { AppConfig } from '../../config/config';
import type { MailService } from '../../mail/mail-service';
import { sendInvitation } from '../session/account-links-service';
import { UserModel } from '../../db/models/user';
import { errors } from '../../http/errors';

/** People administration: admins only. */
export function userRoutes(sequelize: Sequelize, config: AppConfig, mail: MailService): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (_req, res) => {
    res.json({ users: (await listUsers()).map(presentUser) });
  });

  router.post('/', async (req, res) => {
    const input = parseBody(createUserRequestSchema, req.body);
    const user = await createUser(sequelize, currentUser(req).id, input);
    // Without a password the person chooses one from an invitation link.
    if (!input.password) await sendInvitation(sequelize, config, mail, user, currentUser(req).name);
    res.status(201).json(presentUser(user));
  });

  router.patch('/:userId', async (req, res) => {
    const userId = parseId(req.params.userId, 'That person');
    const input = parseBody(updateUserRequestSchema, req.body);
    res.json(presentUser(await updateUser(sequelize, currentUser(req).id, userId, input)));
  });

  router.post('/:userId/invitation', async (req, res) => {
    const user = await UserModel.findByPk(parseId(req.params.userId, 'That person'));
    if (!user) throw errors.notFound('That person');
    if (!user.active) throw errors.conflict('Reactivate the account before inviting the person again.');
    await sendInvitation(sequelize, config, mail, user, currentUser(req).name);
    res.status(202).json({ message: `An invitation is on its way to ${user.email}.` });
  });

  return router;
}
