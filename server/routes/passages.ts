import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { PassageInputSchema, PassagePatchSchema, SongTemposSchema } from '@/shared/schemas';
import { addPassage, deletePassage, listPassages, setPassageTempos, updatePassage } from '@/server/services/passages';

/** Mounted at /api/songs/:songId/passages: the passages of one song's recordings. */
export const songPassagesRouter = Router({ mergeParams: true });
songPassagesRouter.use(requireUser);

songPassagesRouter.get(
  '/',
  handler(async (req, res) => {
    res.json({ passages: await listPassages(currentUser(req), String(req.params.songId)) });
  }),
);

songPassagesRouter.post(
  '/',
  handler(async (req, res) => {
    const input = parseBody(PassageInputSchema, req.body);
    res.status(201).json(await addPassage(currentUser(req), String(req.params.songId), input));
  }),
);

/** Mounted at /api/passages. */
export const passagesRouter = Router();
passagesRouter.use(requireUser);

passagesRouter.patch(
  '/:id',
  handler(async (req, res) => {
    const patch = parseBody(PassagePatchSchema, req.body);
    res.json(await updatePassage(currentUser(req), String(req.params.id), patch));
  }),
);

passagesRouter.delete(
  '/:id',
  handler(async (req, res) => {
    await deletePassage(currentUser(req), String(req.params.id));
    res.status(204).end();
  }),
);

/** Working and goal tempo of a passage: the player's, or set for them by their linked teacher. */
passagesRouter.patch(
  '/:id/tempos',
  handler(async (req, res) => {
    const tempos = parseBody(SongTemposSchema, req.body);
    res.json(await setPassageTempos(currentUser(req), String(req.params.id), tempos));
  }),
);
