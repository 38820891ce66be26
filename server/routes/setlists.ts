import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { SetListInputSchema, SetListPatchSchema } from '@/shared/schemas';
import { createSetList, deleteSetList, getSetList, listSetLists, updateSetList } from '@/server/services/setlists';

/** Mounted at /api/set-lists. */
export const setListsRouter = Router();
setListsRouter.use(requireUser);

setListsRouter.get(
  '/',
  handler(async (req, res) => {
    res.json({ setLists: await listSetLists(currentUser(req)) });
  }),
);

setListsRouter.post(
  '/',
  handler(async (req, res) => {
    res.status(201).json(await createSetList(currentUser(req), parseBody(SetListInputSchema, req.body)));
  }),
);

setListsRouter.get(
  '/:id',
  handler(async (req, res) => {
    res.json(await getSetList(currentUser(req), String(req.params.id)));
  }),
);

setListsRouter.patch(
  '/:id',
  handler(async (req, res) => {
    res.json(await updateSetList(currentUser(req), String(req.params.id), parseBody(SetListPatchSchema, req.body)));
  }),
);

setListsRouter.delete(
  '/:id',
  handler(async (req, res) => {
    await deleteSetList(currentUser(req), String(req.params.id));
    res.status(204).end();
  }),
);
