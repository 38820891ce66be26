import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { PreferencesSchema } from '@/shared/schemas';
import { getPreferences, setPreferences } from '@/server/services/users';

export const meRouter = Router();
meRouter.use(requireUser);

meRouter.get('/', (req, res) => {
  res.json(currentUser(req));
});

meRouter.get(
  '/preferences',
  handler(async (req, res) => {
    res.json(await getPreferences(currentUser(req)));
  }),
);

meRouter.patch(
  '/preferences',
  handler(async (req, res) => {
    res.json(await setPreferences(currentUser(req), parseBody(PreferencesSchema.partial(), req.body)));
  }),
);
