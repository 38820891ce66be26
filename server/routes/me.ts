import { Router } from 'express';
import { currentUser, requireUser } from '../middleware/session';

export const meRouter = Router();
meRouter.get('/', requireUser, (req, res) => {
  res.json(currentUser(req));
});
