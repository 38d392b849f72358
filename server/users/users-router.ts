import { securedRouter } from '../core/secured-router';
import { parseId, parseInput } from '../core/validate';
import { createUserSchema, resetPasswordSchema } from './users-schemas';
import * as users from './users-service';

export function usersRouter() {
  const r = securedRouter('/api/users');

  r.get('/', async (_req, res) => {
    res.json({ items: await users.listUsers() });
  });

  r.post('/', async (req, res) => {
    const input = parseInput(createUserSchema, req.body, 'user');
    res.status(201).json(await users.createUser(input));
  });

  r.post('/:id/password', async (req, res) => {
    const id = parseId(req.params['id'], 'That user');
    const { password } = parseInput(resetPasswordSchema, req.body, 'password');
    await users.resetPassword(id, password);
    res.status(204).end();
  });

  return r.router;
}
