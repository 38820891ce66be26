import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { CandidateInputSchema, CandidatePatchSchema, ChooseTempoSchema, PracticeInputSchema } from '@/shared/schemas';
import { songForOwner, songForReader, toSongDto } from '@/server/services/songs';
import { candidateForOwner, chooseTempo, listCandidates, listPractice, logPractice, toCandidateDto, toPracticeDto } from '@/server/services/tempos';
import { CandidateTempo } from '@/server/models';

/** Mounted at /api/songs/:songId: candidates, the chosen tempo and the practice log of one song. */
export const songTemposRouter = Router({ mergeParams: true });
songTemposRouter.use(requireUser);

songTemposRouter.get('/candidates', handler(async (req, res) => {
  const song = await songForReader(currentUser(req), String(req.params.songId));
  res.json({ candidates: (await listCandidates(song.id)).map(toCandidateDto) });
}));

songTemposRouter.post('/candidates', handler(async (req, res) => {
  const input = parseBody(CandidateInputSchema, req.body);
  const song = await songForOwner(currentUser(req), String(req.params.songId));
  const c = await CandidateTempo.create({ songId: song.id, bpm: input.bpm, rating: input.rating ?? null, note: input.note ?? null });
  res.status(201).json(toCandidateDto(c));
}));

songTemposRouter.post('/choose', handler(async (req, res) => {
  const { bpm, note } = parseBody(ChooseTempoSchema, req.body);
  const song = await songForOwner(currentUser(req), String(req.params.songId));
  res.json(toSongDto(await chooseTempo(song, bpm, note ?? null)));
}));

songTemposRouter.get('/practice', handler(async (req, res) => {
  const song = await songForReader(currentUser(req), String(req.params.songId));
  res.json({ entries: (await listPractice(song.id)).map(toPracticeDto) });
}));

songTemposRouter.post('/practice', handler(async (req, res) => {
  const input = parseBody(PracticeInputSchema, req.body);
  const song = await songForOwner(currentUser(req), String(req.params.songId));
  res.status(201).json(toPracticeDto(await logPractice(song, currentUser(req).id, input)));
}));

/** Mounted at /api/candidates. */
export const candidatesRouter = Router();
candidatesRouter.use(requireUser);

candidatesRouter.patch('/:id', handler(async (req, res) => {
  const patch = parseBody(CandidatePatchSchema, req.body);
  const c = await candidateForOwner(currentUser(req), String(req.params.id));
  res.json(toCandidateDto(await c.update(patch as Partial<CandidateTempo>)));
}));

candidatesRouter.delete('/:id', handler(async (req, res) => {
  const c = await candidateForOwner(currentUser(req), String(req.params.id));
  await c.destroy();
  res.status(204).end();
}));
