import { Router } from 'express';
import { currentUser, requireUser } from '@/server/middleware/session';

export const meRouter = Router();
meRouter.get('/', requireUser, (req, res) => {
  res.json(currentUser(req));
});
