import { Router } from 'express';
import { createUserSchema, updateUserSchema, userVersionSchema } from '../../../shared/schemas/auth';
import { allow } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { listUsers, type UserService } from './service';

/** People management: administrators only. */
export function adminUserRoutes(users: UserService): Router {
  const router = Router();
  router.use(allow('people.manage'));

  router.get('/', async (_req, res) => {
    res.json({ users: await listUsers() });
  });

  router.post('/', async (req, res) => {
    const input = parseInput(createUserSchema, req.body);
    res.status(201).json({ user: await users.addPerson(req.user!.id, input) });
  });

  router.patch('/:id', async (req, res) => {
    const input = parseInput(updateUserSchema, req.body);
    res.json({ user: await users.changePerson(req.user!.id, parseId(req.params.id), input) });
  });

  router.post('/:id/deactivate', async (req, res) => {
    const { version } = parseInput(userVersionSchema, req.body);
    res.json({ user: await users.setActive(req.user!.id, parseId(req.params.id), version, false) });
  });

  router.post('/:id/reactivate', async (req, res) => {
    const { version } = parseInput(userVersionSchema, req.body);
    res.json({ user: await users.setActive(req.user!.id, parseId(req.params.id), version, true) });
  });

  return router;
}
