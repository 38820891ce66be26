import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { TempoMarkInputSchema } from '@/shared/schemas';
import { addTempoMark, deleteTempoMark, listTempoMarks } from '@/server/services/tempo-marks';

/** Mounted at /api/recordings/:recordingId/tempo-marks: the stretches marked rubato or ritardando. */
export const recordingTempoMarksRouter = Router({ mergeParams: true });
recordingTempoMarksRouter.use(requireUser);

recordingTempoMarksRouter.get(
  '/',
  handler(async (req, res) => {
    res.json({ marks: await listTempoMarks(currentUser(req), String(req.params.recordingId)) });
  }),
);

recordingTempoMarksRouter.post(
  '/',
  handler(async (req, res) => {
    const input = parseBody(TempoMarkInputSchema, req.body);
    res.status(201).json(await addTempoMark(currentUser(req), String(req.params.recordingId), input));
  }),
);

/** Mounted at /api/tempo-marks. */
export const tempoMarksRouter = Router();
tempoMarksRouter.use(requireUser);

tempoMarksRouter.delete(
  '/:id',
  handler(async (req, res) => {
    await deleteTempoMark(currentUser(req), String(req.params.id));
    res.status(204).end();
  }),
);
