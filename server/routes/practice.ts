import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { PracticeInputSchema } from '@/shared/schemas';
import { listPractice, logPractice, myPracticeLog, practiceCsv } from '@/server/services/practice';

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

/** Mounted at /api/practice: the whole log of the person asking, across their songs. */
export const practiceRouter = Router();
practiceRouter.use(requireUser);

practiceRouter.get(
  '/',
  handler(async (req, res) => {
    res.json({ entries: await myPracticeLog(currentUser(req)) });
  }),
);

practiceRouter.get(
  '/export',
  handler(async (req, res) => {
    const { fileName, csv } = await practiceCsv(currentUser(req));
    res.type('text/csv; charset=utf-8').attachment(fileName).send(csv);
  }),
);
