import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { requireRole } from '@/server/middleware/session';
import { RoleChangeSchema } from '@/shared/schemas';
import { listUsers, setRole } from '@/server/services/users';

export const adminRouter = Router();
adminRouter.use(requireRole('admin'));

adminRouter.get(
  '/users',
  handler(async (_req, res) => {
    res.json({ users: await listUsers() });
  }),
);

adminRouter.patch(
  '/users/:id/role',
  handler(async (req, res) => {
    const { role } = parseBody(RoleChangeSchema, req.body);
    res.json(await setRole(String(req.params.id), role));
  }),
);
