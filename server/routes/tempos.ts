import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { CandidateInputSchema, CandidatePatchSchema, ChooseTempoSchema } from '@/shared/schemas';
import { addCandidate, chooseTempo, deleteCandidate, listCandidates, updateCandidate } from '@/server/services/tempos';

/** Mounted at /api/songs/:songId: the candidate tempos and the chosen tempo of one song. */
export const songTemposRouter = Router({ mergeParams: true });
songTemposRouter.use(requireUser);

songTemposRouter.get(
  '/candidates',
  handler(async (req, res) => {
    res.json({ candidates: await listCandidates(currentUser(req), String(req.params.songId)) });
  }),
);

songTemposRouter.post(
  '/candidates',
  handler(async (req, res) => {
    const input = parseBody(CandidateInputSchema, req.body);
    res.status(201).json(await addCandidate(currentUser(req), String(req.params.songId), input));
  }),
);

songTemposRouter.post(
  '/choose',
  handler(async (req, res) => {
    const { bpm, note } = parseBody(ChooseTempoSchema, req.body);
    res.json(await chooseTempo(currentUser(req), String(req.params.songId), bpm, note ?? null));
  }),
);

/** Mounted at /api/candidates. */
export const candidatesRouter = Router();
candidatesRouter.use(requireUser);

candidatesRouter.patch(
  '/:id',
  handler(async (req, res) => {
    const patch = parseBody(CandidatePatchSchema, req.body);
    res.json(await updateCandidate(currentUser(req), String(req.params.id), patch));
  }),
);

candidatesRouter.delete(
  '/:id',
  handler(async (req, res) => {
    await deleteCandidate(currentUser(req), String(req.params.id));
    res.status(204).end();
  }),
);
