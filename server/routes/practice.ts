import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { PracticeInputSchema } from '@/shared/schemas';
import { listPractice, logPractice } from '@/server/services/practice';

/** Mounted at /api/songs/:songId/practice: the practice log of one song. */
export const songPracticeRouter = Router({ mergeParams: true });
songPracticeRouter.use(requireUser);

songPracticeRouter.get(
  '/',
  handler(async (req, res) => {
    res.json({ entries: await listPractice(currentUser(req), String(req.params.songId)) });
  }),
);

songPracticeRouter.post(
  '/',
  handler(async (req, res) => {
    const input = parseBody(PracticeInputSchema, req.body);
    res.status(201).json(await logPractice(currentUser(req), String(req.params.songId), input));
  }),
);
